import { Inject, Injectable } from '@nestjs/common';
import { ApiError } from '../common/api-error';
import { APP_CONFIG } from '../config/config.tokens';
import type { AppConfig } from '../config/app-config';
import { missing } from '../revisions/revisions.service';
import { ExportsRepository } from './exports.repository';
import { flagsWorkbook } from './flags-workbook';
import { resultsWorkbook } from './results-workbook';

function fileBase(number: string, name: string): string {
  return `${number || name}`.replace(/[^A-Za-z0-9_-]+/g, '-').replace(/^-+|-+$/g, '') || 'project';
}

@Injectable()
export class ExportsService {
  constructor(
    private readonly exportsRepo: ExportsRepository,
    @Inject(APP_CONFIG) private readonly config: AppConfig,
  ) {}

  /** The results workbook of a revision, named after the project and the revision number. */
  async revisionResults(projectId: number, revisionId: number): Promise<{ fileName: string; bytes: Buffer }> {
    const rev = await this.exportsRepo.revision(projectId, revisionId);
    if (!rev) throw missing(revisionId);
    const [members, results] = await Promise.all([this.exportsRepo.members(revisionId), this.exportsRepo.results(revisionId)]);
    const base = fileBase(rev.project_number, rev.project_name);
    return { fileName: `${base}-revision-${rev.number}-results.xlsx`, bytes: await resultsWorkbook(rev, members, results) };
  }

  /** Every flag of the project, named after the project and the day (UTC). */
  async flags(projectId: number): Promise<{ fileName: string; bytes: Buffer }> {
    const project = await this.exportsRepo.flagsProject(projectId);
    if (!project) throw new ApiError('NOT_FOUND', `Project ${projectId} was not found.`);
    const flags = await this.exportsRepo.flags(projectId, project.revision_id);
    const madeAt = new Date();
    const bytes = await flagsWorkbook({ project, flags, publicUrl: this.config.publicUrl, projectId, madeAt });
    return { fileName: `${fileBase(project.project_number, project.project_name)}-flags-${madeAt.toISOString().slice(0, 10)}.xlsx`, bytes };
  }
}
