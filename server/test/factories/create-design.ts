import type { DesignDetail, DesignSource } from '@ladderwright/shared/api';
import { DesignsService } from '../../src/designs/designs.service';
import type { TestApp } from '../utils/create-test-app';

let sequence = 0;

/** Creates a design with revision 1 through the service (the same path as POST .../designs). */
export async function createDesign(
  testApp: TestApp,
  projectId: string,
  ownerId: string,
  attrs: { name?: string; from?: DesignSource } = {},
): Promise<DesignDetail> {
  sequence += 1;
  return testApp.app.get(DesignsService).create(
    projectId,
    {
      name: attrs.name ?? `Test design ${sequence}`,
      from: attrs.from ?? { kind: 'template', templateId: 'detectorBias' },
    },
    ownerId,
  );
}
