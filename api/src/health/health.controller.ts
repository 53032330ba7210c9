import { Controller, Get } from '@nestjs/common';
import { ApiError } from '../common/api-error';
import { HealthRepository } from './health.repository';

export interface HealthResponse {
  status: 'ok';
  database: 'ok';
}

/** For load balancers and the start script: 200 when the database answers, 503 otherwise. */
@Controller('health')
export class HealthController {
  constructor(private readonly health: HealthRepository) {}

  @Get()
  async check(): Promise<HealthResponse> {
    try {
      await this.health.ping();
    } catch {
      throw new ApiError('INTERNAL', 'The database is not answering.', undefined, 503);
    }
    return { status: 'ok', database: 'ok' };
  }
}
