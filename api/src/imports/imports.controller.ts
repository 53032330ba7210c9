import { Body, Controller, Delete, Get, HttpCode, Param, Post, Req, Res, UseInterceptors } from '@nestjs/common';
import type { Request, Response } from 'express';
import type { CommitImportResponse, ImportJobAccepted, ImportJobStatus, ImportPreview } from '@sagline/common/api-types';
import { CurrentProject, CurrentUser, ProjectRole } from '../auth/auth.decorators';
import type { ProjectAccess } from '../auth/project-access';
import type { SessionUser } from '../auth/session-user';
import { attachment } from '../revisions/content-disposition';
import { XLSX_TYPE } from '../revisions/revisions.service';
import { CommitImportDto } from './dto/commit-import.dto';
import { ImportsService } from './imports.service';
import { TemplateService } from './template.service';
import { UploadInterceptor, uploadedSchedule } from './upload.interceptor';

/** Journey 1: template downloads, upload → preview, commit, job progress. */
@Controller('projects/:projectId/imports')
export class ImportsController {
  constructor(
    private readonly imports: ImportsService,
    private readonly templates: TemplateService,
  ) {}

  @Get('template')
  @ProjectRole()
  async template(@CurrentProject() project: ProjectAccess, @Res() res: Response): Promise<void> {
    sendXlsx(res, await this.templates.workbook(project.projectId, false));
  }

  @Get('example')
  @ProjectRole()
  async example(@CurrentProject() project: ProjectAccess, @Res() res: Response): Promise<void> {
    sendXlsx(res, await this.templates.workbook(project.projectId, true));
  }

  /** Multipart upload (field `file`): 201 ImportPreview, or 422 with every problem and nothing stored. */
  @Post()
  @HttpCode(201)
  @ProjectRole('engineer', 'manager')
  @UseInterceptors(UploadInterceptor)
  upload(@CurrentProject() project: ProjectAccess, @CurrentUser() user: SessionUser, @Req() req: Request): Promise<ImportPreview> {
    return this.imports.preview(project.projectId, user.id, uploadedSchedule(req));
  }

  /** 201 { revision } when committed in the request, 202 { jobId } when it runs as a background job. */
  @Post(':draftId/commit')
  @ProjectRole('engineer', 'manager')
  async commit(
    @CurrentProject() project: ProjectAccess,
    @CurrentUser() user: SessionUser,
    @Param('draftId') draftId: string,
    @Body() dto: CommitImportDto,
    @Res({ passthrough: true }) res: Response,
  ): Promise<CommitImportResponse | ImportJobAccepted> {
    const outcome = await this.imports.commit(project.projectId, draftId, user.id, dto.label ?? null);
    if (outcome.kind === 'queued') {
      res.status(202);
      return { jobId: outcome.jobId };
    }
    res.status(201);
    return outcome.response;
  }

  @Delete(':draftId')
  @HttpCode(204)
  @ProjectRole('engineer', 'manager')
  async discard(@CurrentProject() project: ProjectAccess, @Param('draftId') draftId: string): Promise<void> {
    await this.imports.discard(project.projectId, draftId);
  }

  @Get('jobs/:jobId')
  @ProjectRole()
  job(@CurrentProject() project: ProjectAccess, @Param('jobId') jobId: string): Promise<ImportJobStatus> {
    return this.imports.jobStatus(project.projectId, jobId);
  }
}

function sendXlsx(res: Response, file: { fileName: string; bytes: Buffer }): void {
  res.setHeader('Content-Type', XLSX_TYPE);
  res.setHeader('Content-Disposition', attachment(file.fileName));
  res.setHeader('Content-Length', String(file.bytes.length));
  res.end(file.bytes);
}
