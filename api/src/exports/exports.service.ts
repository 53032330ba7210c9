import { Injectable } from '@nestjs/common';
import { missing } from '../revisions/revisions.service';
import { ExportsRepository } from './exports.repository';
import { resultsWorkbook } from './results-workbook';

@Injectable()
export class ExportsService {
  constructor(private readonly exportsRepo: ExportsRepository) {}

  /** The results workbook of a revision, named after the project and the revision number. */
  async revisionResults(projectId: number, revisionId: number): Promise<{ fileName: string; bytes: Buffer }> {
    const rev = await this.exportsRepo.revision(projectId, revisionId);
    if (!rev) throw missing(revisionId);
    const [members, results] = await Promise.all([this.exportsRepo.members(revisionId), this.exportsRepo.results(revisionId)]);
    const base = `${rev.project_number || rev.project_name}`.replace(/[^A-Za-z0-9_-]+/g, '-').replace(/^-+|-+$/g, '') || 'project';
    return { fileName: `${base}-revision-${rev.number}-results.xlsx`, bytes: await resultsWorkbook(rev, members, results) };
  }
}
