import { Injectable } from '@nestjs/common';
import type { Me } from '@sagline/common/api-types';
import { toMe } from './users.mapper';
import { UsersRepository } from './users.repository';

@Injectable()
export class UsersService {
  constructor(private readonly users: UsersRepository) {}

  async listAll(): Promise<Me[]> {
    return (await this.users.listAll()).map(toMe);
  }
}
