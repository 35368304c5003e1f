import { join } from 'node:path';
import { Module } from '@nestjs/common';
import { APP_ENV, type AppEnv } from '../config/env';
import { LocalDiskBlobStore } from './local-disk-blob-store';
import { BLOB_STORE } from './storage.types';

/** Provides the blob store: local disk under `<DATA_DIR>/uploads` (the one implementation so far). */
@Module({
  providers: [
    {
      provide: BLOB_STORE,
      inject: [APP_ENV],
      useFactory: (env: AppEnv) => new LocalDiskBlobStore(join(env.dataDir, 'uploads')),
    },
  ],
  exports: [BLOB_STORE],
})
export class StorageModule {}
