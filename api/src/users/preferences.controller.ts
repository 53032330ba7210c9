import { Body, Controller, Get, Patch } from '@nestjs/common';
import type { Preferences } from '@sagline/common/api-types';
import { CurrentUser, SignedIn } from '../auth/auth.decorators';
import type { SessionUser } from '../auth/session-user';
import { UpdatePreferencesDto } from './dto/update-preferences.dto';
import { UsersService } from './users.service';

/** The signed-in person's own e-mail preferences. */
@Controller('me/preferences')
export class PreferencesController {
  constructor(private readonly users: UsersService) {}

  @Get()
  @SignedIn()
  get(@CurrentUser() user: SessionUser): Promise<Preferences> {
    return this.users.preferences(user.id);
  }

  @Patch()
  @SignedIn()
  update(@CurrentUser() user: SessionUser, @Body() dto: UpdatePreferencesDto): Promise<Preferences> {
    return this.users.updatePreferences(user.id, dto);
  }
}
