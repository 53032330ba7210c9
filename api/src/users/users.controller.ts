import { Controller, Get } from '@nestjs/common';
import type { Me } from '@sagline/common/api-types';
import { AdminOnly } from '../auth/auth.decorators';
import { UsersService } from './users.service';

@Controller('users')
export class UsersController {
  constructor(private readonly users: UsersService) {}

  @Get()
  @AdminOnly()
  list(): Promise<Me[]> {
    return this.users.listAll();
  }
}
