import type { SchemaMigration } from './migration.types';

/**
 * Magnetics on the Parts shelf: a core's geometry and material (Ae, le, Ve, window, bobbin, mean turn, Bsat at
 * 25 and 100 °C, Steinmetz k, α, β), magnet wire (copper and overall diameter, enamel grade, breakdown voltage)
 * and insulation tape (thickness, dielectric strength), and the kinds `wire` and `tape`.
 */
export const magneticsParts: SchemaMigration = {
  name: '0011-magnetics-parts',
  async up(context) {
    await context.sequelize.query(`
      ALTER TABLE parts DROP CONSTRAINT parts_kind_check;
      ALTER TABLE parts
        ADD CONSTRAINT parts_kind_check
          CHECK (kind IN ('capacitor', 'diode', 'resistor', 'transistor', 'core', 'wire', 'tape')),
        ADD COLUMN core_area_m2 double precision CHECK (core_area_m2 > 0),
        ADD COLUMN core_path_length_m double precision CHECK (core_path_length_m > 0),
        ADD COLUMN core_volume_m3 double precision CHECK (core_volume_m3 > 0),
        ADD COLUMN window_area_m2 double precision CHECK (window_area_m2 > 0),
        ADD COLUMN bobbin_breadth_m double precision CHECK (bobbin_breadth_m > 0),
        ADD COLUMN bobbin_height_m double precision CHECK (bobbin_height_m > 0),
        ADD COLUMN mean_turn_length_m double precision CHECK (mean_turn_length_m > 0),
        ADD COLUMN saturation_flux_density_25_t double precision CHECK (saturation_flux_density_25_t > 0),
        ADD COLUMN saturation_flux_density_100_t double precision CHECK (saturation_flux_density_100_t > 0),
        ADD COLUMN steinmetz_k double precision CHECK (steinmetz_k > 0),
        ADD COLUMN steinmetz_alpha double precision CHECK (steinmetz_alpha > 0),
        ADD COLUMN steinmetz_beta double precision CHECK (steinmetz_beta > 0),
        ADD COLUMN copper_diameter_m double precision CHECK (copper_diameter_m > 0),
        ADD COLUMN overall_diameter_m double precision CHECK (overall_diameter_m > 0),
        ADD COLUMN enamel_grade double precision CHECK (enamel_grade > 0),
        ADD COLUMN breakdown_voltage_v double precision CHECK (breakdown_voltage_v > 0),
        ADD COLUMN thickness_m double precision CHECK (thickness_m > 0),
        ADD COLUMN dielectric_strength_v_per_m double precision CHECK (dielectric_strength_v_per_m > 0);
    `);
  },
  async down(context) {
    await context.sequelize.query(`
      DELETE FROM parts WHERE kind IN ('wire', 'tape');
      ALTER TABLE parts DROP CONSTRAINT parts_kind_check;
      ALTER TABLE parts
        ADD CONSTRAINT parts_kind_check CHECK (kind IN ('capacitor', 'diode', 'resistor', 'transistor', 'core')),
        DROP COLUMN core_area_m2, DROP COLUMN core_path_length_m, DROP COLUMN core_volume_m3, DROP COLUMN window_area_m2, DROP COLUMN bobbin_breadth_m, DROP COLUMN bobbin_height_m, DROP COLUMN mean_turn_length_m, DROP COLUMN saturation_flux_density_25_t, DROP COLUMN saturation_flux_density_100_t, DROP COLUMN steinmetz_k, DROP COLUMN steinmetz_alpha, DROP COLUMN steinmetz_beta, DROP COLUMN copper_diameter_m, DROP COLUMN overall_diameter_m, DROP COLUMN enamel_grade, DROP COLUMN breakdown_voltage_v, DROP COLUMN thickness_m, DROP COLUMN dielectric_strength_v_per_m;
    `);
  },
};
