import { Injectable, type CanActivate, type ExecutionContext } from '@nestjs/common';
import { Reflector } from '@nestjs/core';
import type { Request } from 'express';
import type { ProjectRole } from '@sagline/common/api-types';
import { ApiError } from '../common/api-error';
import { DataVersion } from '../db/data-version';
import { AuthRepository } from './auth.repository';
import { PROJECT_ACCESS, type ProjectAccess } from './project-access';

export const PROJECT_ROLES_KEY = 'sagline:projectRoles';

/** Roles kept in memory per person and project while the data version stays put. */
const KEPT_MAX = 10_000;
type Found = { role: ProjectRole | null } | undefined;

/**
 * Decides who may use a `/projects/:projectId/...` route, from the roles that
 * `@ProjectRole(...)` lists (none listed: any member). Not on the project, or
 * no such project: 404 with the same message, so ids of other projects cannot
 * be probed. On it with another role: 403. Admins pass wherever a manager would.
 */
@Injectable()
export class ProjectRoleGuard implements CanActivate {
  private readonly kept = new Map<string, { version: number; found: Found }>();

  constructor(
    private readonly reflector: Reflector,
    private readonly auth: AuthRepository,
    private readonly dataVersion: DataVersion,
  ) {}

  /** The caller's role on the project (undefined: no such project), from memory while no role, project or person changed. */
  private async roleOf(projectId: number, userId: number): Promise<Found> {
    const version = this.dataVersion.current();
    const key = `${userId}:${projectId}`;
    const hit = this.kept.get(key);
    if (hit && hit.version === version) return hit.found;
    const found = await this.auth.projectRole(projectId, userId);
    if (version !== null) {
      if (this.kept.size >= KEPT_MAX) this.kept.clear();
      this.kept.set(key, { version, found });
    }
    return found;
  }

  async canActivate(context: ExecutionContext): Promise<boolean> {
    const req = context.switchToHttp().getRequest<Request>();
    const user = req.user;
    if (!user) throw new ApiError('UNAUTHENTICATED', 'You are not signed in (or your session ended); sign in and try again.');
    const allowed = this.reflector.getAllAndOverride<ProjectRole[] | undefined>(PROJECT_ROLES_KEY, [context.getHandler(), context.getClass()]) ?? [];

    const raw = String(req.params.projectId ?? '');
    const projectId = /^[1-9]\d{0,9}$/.test(raw) ? Number(raw) : NaN;
    // Made only when thrown: an error captures a stack trace, a cost every allowed request would pay.
    const notFound = () => new ApiError('NOT_FOUND', `Project ${raw} was not found, or you are not on its team.`);
    if (!Number.isSafeInteger(projectId) || projectId > 2_147_483_647) throw notFound();

    const found = await this.roleOf(projectId, user.id);
    if (!found || (!found.role && !user.isAdmin)) throw notFound();

    const role = found.role;
    const may = allowed.length === 0 || (role !== null && allowed.includes(role)) || (user.isAdmin && allowed.includes('manager'));
    if (!may) {
      throw new ApiError('FORBIDDEN', `Your role on this project (${role ?? 'none'}) cannot do this; it needs ${allowed.join(' or ')}. A manager can change your role.`);
    }
    const access: ProjectAccess = { projectId, role, myRole: role ?? 'admin', canManage: role === 'manager' || user.isAdmin };
    (req as Request & { [PROJECT_ACCESS]?: ProjectAccess })[PROJECT_ACCESS] = access;
    return true;
  }
}
