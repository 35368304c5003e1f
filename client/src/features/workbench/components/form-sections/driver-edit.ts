import type { Design } from '@ladderwright/shared/designs';
import type { DriverStage } from '@ladderwright/shared/driver';
import type { Edit } from '../../document-path';

/** Document path of the driver stage; its fields' issues come back under it. */
export const DRIVER_PATH = 'drive.driver';

/** The document's edit narrowed to its driver stage (a no-op on a design without one). */
export function driverEdit(edit: Edit<Design>): Edit<DriverStage> {
  return (mutate, key) =>
    edit((d) => {
      if (d.drive.kind === 'driver') mutate(d.drive.driver);
    }, key);
}
