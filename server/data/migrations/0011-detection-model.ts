import { DataTypes } from 'sequelize';
import type { Migration } from '../migrator';

/**
 * The detection model reaches the libraries, sites and plans: a target's
 * light and whether it floats on the water; a condition set's sea and the
 * lights behind a target at night; a coast site's land/sea mask and an
 * inland site's stated ground height for smooth-earth figures; a plan's
 * lookout (resolving angle, optics).
 */
export const up: Migration = async ({ context: qi }) => {
  await qi.addColumn('target_profiles', 'light_intensity_cd', { type: DataTypes.DOUBLE, allowNull: true });
  await qi.addColumn('target_profiles', 'on_water', { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false });
  await qi.sequelize.query(
    `UPDATE target_profiles SET on_water = true WHERE kind IN ('vessel', 'small-craft', 'raft', 'person-in-water')`,
  );
  await qi.addColumn('condition_sets', 'sea_state', { type: DataTypes.SMALLINT, allowNull: true });
  await qi.addColumn('condition_sets', 'significant_wave_height_m', { type: DataTypes.DOUBLE, allowNull: true });
  await qi.addColumn('condition_sets', 'background_lighting', {
    type: DataTypes.STRING(8),
    allowNull: false,
    defaultValue: 'none',
  });
  await qi.addColumn('sites', 'sea_level_max_m', { type: DataTypes.DOUBLE, allowNull: true });
  await qi.addColumn('sites', 'sea_area', { type: DataTypes.JSONB, allowNull: true });
  await qi.addColumn('sites', 'target_ground_m', { type: DataTypes.DOUBLE, allowNull: true });
  await qi.addColumn('plans', 'lookout', {
    type: DataTypes.JSONB,
    allowNull: false,
    defaultValue: { resolutionArcmin: 1, magnification: 1 },
  });
};

export const down: Migration = async ({ context: qi }) => {
  await qi.removeColumn('plans', 'lookout');
  await qi.removeColumn('sites', 'target_ground_m');
  await qi.removeColumn('sites', 'sea_area');
  await qi.removeColumn('sites', 'sea_level_max_m');
  await qi.removeColumn('condition_sets', 'background_lighting');
  await qi.removeColumn('condition_sets', 'significant_wave_height_m');
  await qi.removeColumn('condition_sets', 'sea_state');
  await qi.removeColumn('target_profiles', 'on_water');
  await qi.removeColumn('target_profiles', 'light_intensity_cd');
};
