import { SetMetadata } from '@nestjs/common';

export const ALLOWED_WHEN_ARCHIVED_KEY = 'lw:allowedWhenArchived';

/**
 * Marks a non-GET route the project guard lets through on an archived project: one that changes nothing
 * (a POST only for its body, such as evaluate) or that reopens the project (unarchive).
 */
export const AllowedWhenArchived = (): MethodDecorator => SetMetadata(ALLOWED_WHEN_ARCHIVED_KEY, true);
