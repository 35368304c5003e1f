import { type ArgumentsHost, Catch, type ExceptionFilter, PayloadTooLargeException } from '@nestjs/common';
import type { Response } from 'express';
import type { ApiErrorBody } from '@ladderwright/shared/api';

/** Turns multer's bare "File too large" into a 413 that names the field and the limit. */
@Catch(PayloadTooLargeException)
export class UploadLimitFilter implements ExceptionFilter {
  constructor(private readonly limits: Record<string, number>) {}

  catch(_error: PayloadTooLargeException, host: ArgumentsHost): void {
    const response = host.switchToHttp().getResponse<Response>();
    const described = Object.entries(this.limits)
      .map(([field, bytes]) => `${field} ${formatBytes(bytes)}`)
      .join(', ');
    const body: ApiErrorBody = {
      statusCode: 413,
      code: 'payload_too_large',
      message: `The upload is larger than the limit (${described})`,
      field: Object.keys(this.limits)[0] ?? 'file',
    };
    response.status(413).json(body);
  }
}

export function formatBytes(bytes: number): string {
  return bytes >= 1024 * 1024 ? `${bytes / (1024 * 1024)} MB` : `${bytes / 1024} kB`;
}
