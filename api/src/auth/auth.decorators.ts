import { applyDecorators, createParamDecorator, SetMetadata, UseGuards, type ExecutionContext } from '@nestjs/common';
import type { Request } from 'express';
import type { ProjectRole as Role } from '@sagline/common/api-types';
import { AdminGuard } from './admin.guard';
import { PROJECT_ACCESS, type ProjectAccess } from './project-access';
import { PROJECT_ROLES_KEY, ProjectRoleGuard } from './project-role.guard';
import type { SessionUser } from './session-user';
import { SignedInGuard } from './signed-in.guard';

/** The route needs a signed-in person. */
export const SignedIn = () => UseGuards(SignedInGuard);

/** The route needs a signed-in admin. */
export const AdminOnly = () => UseGuards(SignedInGuard, AdminGuard);

/**
 * The route needs a role on the project of `:projectId`; with no roles given,
 * any member (viewer included) may use it. Admins count as managers.
 */
export const ProjectRole = (...roles: Role[]) =>
  applyDecorators(SetMetadata(PROJECT_ROLES_KEY, roles), UseGuards(SignedInGuard, ProjectRoleGuard));

/** The signed-in person (after SignedInGuard). */
export const CurrentUser = createParamDecorator((_: unknown, ctx: ExecutionContext): SessionUser => {
  return ctx.switchToHttp().getRequest<Request>().user!;
});

/** What ProjectRoleGuard found: project id, role, whether the caller may manage. */
export const CurrentProject = createParamDecorator((_: unknown, ctx: ExecutionContext): ProjectAccess => {
  return (ctx.switchToHttp().getRequest<Request>() as Request & { [PROJECT_ACCESS]: ProjectAccess })[PROJECT_ACCESS];
});
