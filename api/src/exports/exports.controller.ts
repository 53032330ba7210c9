import { Controller, Get, Param, Res } from '@nestjs/common';
import type { Response } from 'express';
import { CurrentProject, ProjectRole } from '../auth/auth.decorators';
import type { ProjectAccess } from '../auth/project-access';
import { ParseIdPipe } from '../common/parse-id.pipe';
import { attachment } from '../revisions/content-disposition';
import { XLSX_TYPE } from '../revisions/revisions.service';
import { ExportsService } from './exports.service';

/** Workbooks to take away: any member of the project may download them. */
@Controller('projects/:projectId/revisions/:revisionId')
export class ExportsController {
  constructor(private readonly exportsService: ExportsService) {}

  @Get('results.xlsx')
  @ProjectRole()
  async results(@CurrentProject() project: ProjectAccess, @Param('revisionId', ParseIdPipe) revisionId: number, @Res() res: Response): Promise<void> {
    const file = await this.exportsService.revisionResults(project.projectId, revisionId);
    res.setHeader('Content-Type', XLSX_TYPE);
    res.setHeader('Content-Disposition', attachment(file.fileName));
    res.setHeader('Content-Length', String(file.bytes.length));
    res.end(file.bytes);
  }
}

/** The flags workbook: any member of the project may download it. */
@Controller('projects/:projectId')
export class FlagsExportController {
  constructor(private readonly exportsService: ExportsService) {}

  @Get('flags.xlsx')
  @ProjectRole()
  async flags(@CurrentProject() project: ProjectAccess, @Res() res: Response): Promise<void> {
    const file = await this.exportsService.flags(project.projectId);
    res.setHeader('Content-Type', XLSX_TYPE);
    res.setHeader('Content-Disposition', attachment(file.fileName));
    res.setHeader('Content-Length', String(file.bytes.length));
    res.end(file.bytes);
  }
}
