import fs from 'node:fs';
import path from 'node:path';
import type { INestApplicationContext } from '@nestjs/common';
import { DEMO_PEOPLE, DEMO_PROJECT } from '@sagline/database';
import { DemoHistory, type StoryMoment } from '../flags/demo-history';
import { ImportCommitService } from './import-commit.service';
import { ImportsRepository } from './imports.repository';
import { ImportsService } from './imports.service';

/** The demo schedule (samples/README.md): 391 members of the invented Halvercote Yard. */
export const DEMO_WORKBOOK = path.resolve(__dirname, '..', '..', '..', 'samples', 'halvercote-yard.xlsx');

/**
 * When the demo's story puts its start (demo-history.ts): the project was set
 * up four weeks ago and revision 1 uploaded two days later; the demo flags
 * (flags/demo-flags.ts) follow over the weeks after it.
 */
export const DEMO_STORY = {
  projectCreated: { daysAgo: 27, time: '08:40' },
  revisionUploaded: { daysAgo: 25, time: '15:10' },
} as const satisfies Record<string, StoryMoment>;

/**
 * Puts the demo schedule in as revision 1 of the demo project, through the
 * same code as an upload and a commit (parse, checks, one transaction), as
 * uploaded by the demo engineer, then dates the revision, its activity entry
 * and the project's creation as DEMO_STORY tells. Does nothing when the project is missing
 * (run the database seed first) or already has a revision. Returns one line
 * saying what it did.
 */
export async function seedDemoRevision(app: INestApplicationContext, workbook = DEMO_WORKBOOK): Promise<string> {
  const repo = app.get(ImportsRepository);
  const projectId = await repo.projectIdByNumber(DEMO_PROJECT.number);
  if (projectId === undefined) return `no project ${DEMO_PROJECT.number} (run the database seed first): nothing imported`;
  if ((await repo.revisionCount(projectId)) > 0) return `${DEMO_PROJECT.name} already has a revision: nothing imported`;
  const engineer = DEMO_PEOPLE.find((p) => p.role === 'engineer')!;
  const engineerId = await repo.userIdByEmail(engineer.email);
  if (engineerId === undefined) return `no demo engineer ${engineer.email} (run the database seed first): nothing imported`;

  const fileName = path.basename(workbook);
  const history = new DemoHistory(app, projectId);
  const { preview, revision } = await history.step(DEMO_STORY.revisionUploaded, async () => {
    const preview = await app.get(ImportsService).preview(projectId, engineerId, { fileName, bytes: fs.readFileSync(workbook) });
    const { revision } = await app.get(ImportCommitService).commit(projectId, preview.draftId, { label: 'Rev A, for checking', actorId: engineerId });
    return { preview, revision };
  });
  await history.backdateDemoHistory(DEMO_STORY.projectCreated);
  const warnings = preview.problems.length;
  return (
    `imported ${fileName} into ${DEMO_PROJECT.name} as revision ${revision.number} (uploaded by ${engineer.name}, dated ${DEMO_STORY.revisionUploaded.daysAgo} days ago): ` +
    `${revision.memberCount} members, ${revision.failCount} failing${warnings ? `, ${warnings} warnings` : ''}`
  );
}
