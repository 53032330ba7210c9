import { Controller, Get, Param, Res } from '@nestjs/common';
import type { Response } from 'express';
import type { RevisionDetail, RevisionSummary } from '@sagline/common/api-types';
import { CurrentProject, ProjectRole } from '../auth/auth.decorators';
import type { ProjectAccess } from '../auth/project-access';
import { ParseIdPipe } from '../common/parse-id.pipe';
import { attachment } from './content-disposition';
import { RevisionsService } from './revisions.service';

/** Committed revisions: any member of the project may read them. */
@Controller('projects/:projectId/revisions')
export class RevisionsController {
  constructor(private readonly revisions: RevisionsService) {}

  @Get()
  @ProjectRole()
  list(@CurrentProject() project: ProjectAccess): Promise<RevisionSummary[]> {
    return this.revisions.list(project.projectId);
  }

  @Get(':revisionId')
  @ProjectRole()
  detail(@CurrentProject() project: ProjectAccess, @Param('revisionId', ParseIdPipe) revisionId: number): Promise<RevisionDetail> {
    return this.revisions.detail(project.projectId, revisionId);
  }

  @Get(':revisionId/file')
  @ProjectRole()
  async file(@CurrentProject() project: ProjectAccess, @Param('revisionId', ParseIdPipe) revisionId: number, @Res() res: Response): Promise<void> {
    const file = await this.revisions.file(project.projectId, revisionId);
    res.setHeader('Content-Type', file.contentType);
    res.setHeader('Content-Disposition', attachment(file.fileName));
    res.setHeader('Content-Length', String(file.bytes.length));
    res.end(file.bytes);
  }
}
