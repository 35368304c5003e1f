import { Global, Module } from '@nestjs/common';
import { SessionCacheService } from './session-cache.service';

/** Global, so that the users module can forget the cached sessions of an account it changes. */
@Global()
@Module({ providers: [SessionCacheService], exports: [SessionCacheService] })
export class SessionCacheModule {}
