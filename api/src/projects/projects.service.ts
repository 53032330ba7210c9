import { Injectable } from '@nestjs/common';
import type { Project, ProjectSummary } from '@sagline/common/api-types';
import { ActivityService } from '../activity/activity.service';
import type { ProjectAccess } from '../auth/project-access';
import type { SessionUser } from '../auth/session-user';
import { notFound } from '../common/api-error';
import { TransactionRunner } from '../db/transaction';
import type { CreateProjectDto } from './dto/create-project.dto';
import type { UpdateProjectDto } from './dto/update-project.dto';
import { toProject, toProjectSummary } from './projects.mapper';
import { ProjectsRepository } from './projects.repository';

@Injectable()
export class ProjectsService {
  constructor(
    private readonly projects: ProjectsRepository,
    private readonly tx: TransactionRunner,
    private readonly activity: ActivityService,
  ) {}

  async list(user: SessionUser): Promise<ProjectSummary[]> {
    const rows = await this.projects.listForUser(user.id, user.isAdmin);
    return rows.map((r) => toProjectSummary(r, r.role ?? 'admin'));
  }

  /** A new project with its levels (admins only: the guard decides). The creator is not given a role. */
  async create(user: SessionUser, dto: CreateProjectDto): Promise<Project> {
    return this.tx.run(async (trx) => {
      const row = await this.projects.insert(trx, { name: dto.name, number: dto.number, unitSystem: dto.unitSystem, createdBy: user.id });
      await this.projects.replaceLevels(trx, row.id, dto.levels);
      await this.activity.record(trx, {
        projectId: row.id,
        actorId: user.id,
        action: 'project.created',
        summary: `${user.name} created the project ${row.name} (${row.number}) with ${dto.levels.length} level${dto.levels.length === 1 ? '' : 's'}`,
        data: { levels: dto.levels },
      });
      return toProject(row, await this.projects.levels(row.id, trx), 'admin');
    });
  }

  async get(access: ProjectAccess): Promise<Project> {
    const row = await this.projects.findById(access.projectId);
    if (!row) throw notFound(`Project ${access.projectId} was not found, or you are not on its team.`);
    return toProject(row, await this.projects.levels(row.id), access.myRole);
  }

  async update(access: ProjectAccess, user: SessionUser, dto: UpdateProjectDto): Promise<Project> {
    return this.tx.run(async (trx) => {
      const before = await this.projects.findById(access.projectId, trx);
      if (!before) throw notFound(`Project ${access.projectId} was not found, or you are not on its team.`);
      const oldLevels = (await this.projects.levels(access.projectId, trx)).map((l) => l.name);
      const changes: string[] = [];
      if (dto.name !== undefined && dto.name !== before.name) changes.push(`name to "${dto.name}"`);
      if (dto.number !== undefined && dto.number !== before.number) changes.push(`number to "${dto.number}"`);
      if (dto.unitSystem !== undefined && dto.unitSystem !== before.unit_system) changes.push(`unit system to ${dto.unitSystem}`);
      const levelsChanged = dto.levels !== undefined && dto.levels.join('\u0000') !== oldLevels.join('\u0000');
      if (levelsChanged) changes.push(`levels to ${dto.levels!.join(', ')}`);

      if (changes.length) {
        await this.projects.update(trx, access.projectId, dto);
        if (levelsChanged) await this.projects.replaceLevels(trx, access.projectId, dto.levels!);
        await this.activity.record(trx, {
          projectId: access.projectId,
          actorId: user.id,
          action: 'project.updated',
          summary: `${user.name} changed the ${changes.join('; ')}`,
          data: { ...dto, ...(levelsChanged ? { previousLevels: oldLevels } : {}) },
        });
      }
      const row = (await this.projects.findById(access.projectId, trx))!;
      return toProject(row, await this.projects.levels(access.projectId, trx), access.myRole);
    });
  }
}
