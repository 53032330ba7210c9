import { Injectable, type CallHandler, type ExecutionContext, type NestInterceptor } from '@nestjs/common';
import type { Request, Response } from 'express';
import multer from 'multer';
import type { Observable } from 'rxjs';
import { ApiError } from '../common/api-error';
import { ImportSettings } from './import-settings';

/** The multipart field the schedule comes in. */
export const UPLOAD_FIELD = 'file';

/** The uploaded schedule as the controller sees it. */
export interface UploadedSchedule {
  fileName: string;
  bytes: Buffer;
}

function mb(bytes: number): string {
  const v = bytes / 1024 / 1024;
  return `${v >= 10 ? Math.round(v) : Number(v.toFixed(1))} MB`;
}

/**
 * Reads the multipart upload into memory (multer, one file in field `file`,
 * the cap from ImportSettings read at start) and turns multer's errors into
 * our error shape: 413 PAYLOAD_TOO_LARGE over the cap, 400 for a wrong field
 * or several files. File names are read as UTF-8 (busboy would take latin1).
 */
@Injectable()
export class UploadInterceptor implements NestInterceptor {
  private readonly middleware: ReturnType<ReturnType<typeof multer>['single']>;

  constructor(private readonly settings: ImportSettings) {
    this.middleware = multer({
      storage: multer.memoryStorage(),
      limits: { fileSize: settings.maxFileBytes, files: 1, fields: 10, parts: 12 },
      defParamCharset: 'utf8',
    }).single(UPLOAD_FIELD);
  }

  async intercept(context: ExecutionContext, next: CallHandler): Promise<Observable<unknown>> {
    const http = context.switchToHttp();
    const req = http.getRequest<Request>();
    const res = http.getResponse<Response>();
    if (!req.is('multipart/form-data')) {
      throw new ApiError('IMPORT_FILE_INVALID', `Send the schedule as multipart/form-data with the file in the field "${UPLOAD_FIELD}" (a browser form upload does this).`);
    }
    await new Promise<void>((resolve, reject) => {
      this.middleware(req, res, (err: unknown) => (err ? reject(this.toApiError(err)) : resolve()));
    });
    if (!req.file) {
      throw new ApiError('IMPORT_FILE_INVALID', `No file arrived: attach the schedule (.xlsx or .csv) in the multipart field "${UPLOAD_FIELD}".`);
    }
    return next.handle();
  }

  private toApiError(err: unknown): ApiError {
    if (err instanceof multer.MulterError) {
      switch (err.code) {
        case 'LIMIT_FILE_SIZE':
          return new ApiError(
            'PAYLOAD_TOO_LARGE',
            `The file is larger than the ${mb(this.settings.maxFileBytes)} upload limit. Remove sheets other than Members and Loads, or split the schedule into several files.`,
          );
        case 'LIMIT_UNEXPECTED_FILE':
          return new ApiError('IMPORT_FILE_INVALID', `Upload one file, in the multipart field "${UPLOAD_FIELD}" (got a file in "${err.field ?? '?'}").`);
        default:
          return new ApiError('IMPORT_FILE_INVALID', `The upload could not be read (${err.message}). Upload one .xlsx or .csv file in the field "${UPLOAD_FIELD}".`);
      }
    }
    return new ApiError('IMPORT_FILE_INVALID', 'The upload was cut off or is not valid multipart/form-data; try the upload again.');
  }
}

/** The file multer left on the request. */
export function uploadedSchedule(req: Request): UploadedSchedule {
  const file = req.file!;
  return { fileName: file.originalname || 'schedule', bytes: file.buffer };
}
