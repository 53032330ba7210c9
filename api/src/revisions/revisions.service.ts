import { Injectable } from '@nestjs/common';
import type { RevisionDetail, RevisionSummary } from '@sagline/common/api-types';
import { notFound } from '../common/api-error';
import { toRevisionDetail, toRevisionSummary } from './revisions.mapper';
import { RevisionsRepository } from './revisions.repository';

@Injectable()
export class RevisionsService {
  constructor(private readonly revisions: RevisionsRepository) {}

  async list(projectId: number): Promise<RevisionSummary[]> {
    return (await this.revisions.listByProject(projectId)).map(toRevisionSummary);
  }

  async detail(projectId: number, revisionId: number): Promise<RevisionDetail> {
    const row = await this.revisions.find(projectId, revisionId);
    if (!row) throw missing(revisionId);
    return toRevisionDetail(row);
  }

  /** The uploaded file, byte for byte. */
  async file(projectId: number, revisionId: number): Promise<{ fileName: string; contentType: string; bytes: Buffer }> {
    const row = await this.revisions.findFile(projectId, revisionId);
    if (!row) throw missing(revisionId);
    const contentType = row.file_type === 'xlsx' ? XLSX_TYPE : 'text/csv; charset=utf-8';
    return { fileName: row.file_name, contentType, bytes: row.file_bytes };
  }
}

export const XLSX_TYPE = 'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet';

export function missing(revisionId: number) {
  return notFound(`Revision ${revisionId} was not found in this project; the revisions list shows the ones there are.`);
}
