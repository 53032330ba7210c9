import { randomUUID } from 'node:crypto';
import { Injectable } from '@nestjs/common';
import type { CommitImportResponse, ImportJobStatus, ImportPreview } from '@sagline/common/api-types';
import { analyzeMembers } from '../checks/member-analysis';
import { LimitSetsService } from '../checks/limit-sets.service';
import { notFound } from '../common/api-error';
import { JobQueue } from '../jobs/job-queue';
import { JobsRepository, type ImportJobRow } from '../jobs/jobs.repository';
import { RevisionsRepository } from '../revisions/revisions.repository';
import { DraftCache } from './draft-cache';
import { ImportCommitService } from './import-commit.service';
import { rowsInvalid } from './import-errors';
import { ImportSettings } from './import-settings';
import { ImportsRepository, packMembers } from './imports.repository';
import { previewDiff, withVerdicts } from './preview-diff';
import { readSchedule } from './schedule-reader';
import type { UploadedSchedule } from './upload.interceptor';

/** The pg-boss queue of background commits. */
export const COMMIT_QUEUE = 'import-commit';

export interface CommitJobData {
  jobId: string;
}

export type CommitOutcome = { kind: 'committed'; response: CommitImportResponse } | { kind: 'queued'; jobId: string };

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/**
 * Journey 1 on the server: an upload becomes a checked draft with a preview
 * (problems, diff to the latest revision, verdict flips); a commit turns the
 * draft into the next revision, in the request for small schedules and as a
 * background job above the threshold.
 */
@Injectable()
export class ImportsService {
  constructor(
    private readonly drafts: ImportsRepository,
    private readonly revisions: RevisionsRepository,
    private readonly limitSets: LimitSetsService,
    private readonly committer: ImportCommitService,
    private readonly queue: JobQueue,
    private readonly jobs: JobsRepository,
    private readonly settings: ImportSettings,
    private readonly cache: DraftCache,
  ) {}

  /**
   * Reads, validates and checks an upload. Any fatal problem: 422 with every
   * problem, and nothing is written (not even the draft). Otherwise the draft
   * is stored and its preview returned.
   */
  async preview(projectId: number, uploaderId: number, upload: UploadedSchedule): Promise<ImportPreview> {
    const context = await this.drafts.projectContext(projectId);
    if (!context) throw notFound(`Project ${projectId} was not found, or you are not on its team.`);
    const { row: limitRow, set } = await this.limitSets.forProject(projectId);

    const read = await readSchedule(
      upload.bytes,
      upload.fileName,
      { unitSystem: context.unitSystem, categories: set.categories, levels: context.levels.map((l) => l.name), team: context.team },
      this.settings,
    );
    if (read.problems.some((p) => p.severity === 'error')) throw rowsInvalid(read.problems);
    // Compressed on another thread while the engine runs; awaited when the draft is stored.
    const membersGz = packMembers(read.members);
    membersGz.catch(() => undefined); // a rejection is seen where it is awaited; not unhandled if the engine throws first

    const outcome = analyzeMembers(read.members, set, { sheet: read.membersSheet });
    if (outcome.problems.length) throw rowsInvalid([...outcome.problems, ...read.problems]);

    const latest = await this.revisions.latest(projectId);
    const previous = latest ? await this.revisions.membersOf(latest.id) : [];
    const diff = previewDiff(latest ?? null, previous, withVerdicts(read.members, outcome.analyses), context.unitSystem);

    await this.drafts.deleteExpired();
    const createdAt = new Date();
    const expiresAt = new Date(createdAt.getTime() + this.settings.draftHours * 3_600_000);
    const preview: ImportPreview = {
      draftId: randomUUID(),
      fileName: upload.fileName,
      fileType: read.fileType,
      fileSize: upload.bytes.length,
      unitSystem: context.unitSystem,
      memberCount: read.members.length,
      loadRowCount: read.loadRows,
      problems: read.problems,
      fatal: false,
      diff,
      summary: { pass: outcome.pass, fail: outcome.fail, unchecked: outcome.unchecked },
      limitSet: { id: limitRow.id, name: limitRow.name },
      createdAt: createdAt.toISOString(),
      expiresAt: expiresAt.toISOString(),
    };
    await this.drafts.insertDraft({
      id: preview.draftId,
      projectId,
      uploadedBy: uploaderId,
      fileName: upload.fileName,
      fileType: read.fileType,
      fileBytes: upload.bytes,
      unitSystem: context.unitSystem,
      limitSetId: limitRow.id,
      limitSetVersion: limitRow.version,
      membersGz: await membersGz,
      problems: read.problems,
      summary: {
        ...preview.summary,
        against: latest?.id ?? null,
        added: diff.added.length,
        removed: diff.removed.length,
        changed: diff.changed.length,
        flips: diff.flips.length,
      },
      memberCount: read.members.length,
      loadRowCount: read.loadRows,
      createdAt,
      expiresAt,
    });
    this.cache.put(preview.draftId, { members: read.members, outcome, limitSetId: limitRow.id, limitSetVersion: limitRow.version });
    return preview;
  }

  /** Commits a draft now, or queues it when it has more members than the job threshold. */
  async commit(projectId: number, draftId: string, actorId: number, label: string | null): Promise<CommitOutcome> {
    if (!UUID.test(draftId)) throw notFound(`There is no upload ${draftId} waiting to be committed; upload the schedule again.`);
    const header = await this.drafts.findHeader(projectId, draftId);
    if (header && header.member_count > this.settings.jobThresholdMembers) {
      const open = await this.jobs.findOpenForDraft(draftId);
      if (open) return { kind: 'queued', jobId: open.id };
      const jobId = randomUUID();
      await this.jobs.insert({ id: jobId, projectId, kind: 'commit', draftId, requestedBy: actorId, request: { label } });
      await this.queue.send(COMMIT_QUEUE, { jobId } satisfies CommitJobData, {
        id: jobId,
        retryLimit: this.settings.jobRetries,
        expireInSeconds: this.settings.jobExpireSeconds,
      });
      return { kind: 'queued', jobId };
    }
    return { kind: 'committed', response: await this.committer.commit(projectId, draftId, { label, actorId }) };
  }

  async discard(projectId: number, draftId: string): Promise<void> {
    if (!UUID.test(draftId) || !(await this.drafts.discard(projectId, draftId))) {
      throw notFound('There is no such upload waiting to be committed (already committed, discarded or expired).');
    }
  }

  async jobStatus(projectId: number, jobId: string): Promise<ImportJobStatus> {
    const row = UUID.test(jobId) ? await this.jobs.find(projectId, jobId) : undefined;
    if (!row) throw notFound(`There is no import job ${jobId} in this project.`);
    return toJobStatus(row);
  }
}

export function toJobStatus(row: ImportJobRow): ImportJobStatus {
  const status: ImportJobStatus = {
    jobId: row.id,
    kind: row.kind,
    state: row.state,
    progress: row.progress,
    step: row.step,
    attempts: row.attempts,
    createdAt: row.created_at.toISOString(),
    updatedAt: row.updated_at.toISOString(),
  };
  if (row.state === 'completed' && row.result) status.result = row.result as CommitImportResponse;
  if (row.error && (row.state === 'failed' || row.state === 'queued')) status.error = row.error;
  return status;
}
