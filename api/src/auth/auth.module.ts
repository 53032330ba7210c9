import { Global, Module, RequestMethod, type MiddlewareConsumer, type NestModule } from '@nestjs/common';
import { ActivityModule } from '../activity/activity.module';
import { UsersModule } from '../users/users.module';
import { UsersRepository } from '../users/users.repository';
import { AdminGuard } from './admin.guard';
import { AuthController } from './auth.controller';
import { SessionStore } from '../db/session-store';
import { AuthRepository } from './auth.repository';
import { AuthService } from './auth.service';
import { AUTHENTICATOR, createAuthenticator } from './authenticator';
import { ProjectRoleGuard } from './project-role.guard';
import { SignInLimitMiddleware } from './sign-in-limit.middleware';
import { SignInLimitRepository } from './sign-in-limit.repository';
import { SignInService } from './sign-in.service';
import { SignedInGuard } from './signed-in.guard';

/** Global so every area's controllers can use the guards and decorators. */
@Global()
@Module({
  imports: [UsersModule, ActivityModule],
  controllers: [AuthController],
  providers: [
    AuthRepository,
    AuthService,
    SignInService,
    SignInLimitRepository,
    SignedInGuard,
    AdminGuard,
    ProjectRoleGuard,
    { provide: AUTHENTICATOR, inject: [AuthService, UsersRepository, SessionStore], useFactory: createAuthenticator },
  ],
  exports: [AuthRepository, AUTHENTICATOR, SignedInGuard, AdminGuard, ProjectRoleGuard],
})
export class AuthModule implements NestModule {
  configure(consumer: MiddlewareConsumer): void {
    consumer.apply(SignInLimitMiddleware).forRoutes({ path: 'auth/sign-in', method: RequestMethod.POST });
  }
}
