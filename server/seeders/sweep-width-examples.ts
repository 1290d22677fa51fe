import type { Sequelize } from 'sequelize';
import type { SweepWidthTableInput } from '@/shared/schemas/sweep-width';
import { OrganizationModel } from '@/server/data/models';
import { sweepWidthTablesRepository } from '@/server/data/repositories/sweep-width-tables-repository';

/**
 * The starter sweep-width table: invented numbers that only show how a table
 * is laid out. It is marked as an example in its flag, name, edition, source
 * and notes, and is never to be read as published values.
 */
export const EXAMPLE_SWEEP_WIDTH_TABLE: SweepWidthTableInput = {
  name: 'Example — invented sweep widths (not for planning)',
  edition: 'Example, not an edition',
  sourceName: 'Invented for the Kenning demo; not from any publication',
  isExample: true,
  notes:
    'These values are made up to show the layout of a table. Enter your agency’s own tables, naming the edition ' +
    'and source you took them from, and retire this example.',
  rows: [
    { searchObject: 'Person in the water', visibilityM: 5_000, heightM: 10, sweepWidthM: 300 },
    { searchObject: 'Person in the water', visibilityM: 20_000, heightM: 10, sweepWidthM: 500 },
    { searchObject: 'Life raft, 4 persons', visibilityM: 5_000, heightM: 10, sweepWidthM: 2_000 },
    { searchObject: 'Life raft, 4 persons', visibilityM: 20_000, heightM: 10, sweepWidthM: 4_000 },
    { searchObject: 'Small open boat', visibilityM: 5_000, heightM: 10, sweepWidthM: 2_500 },
    { searchObject: 'Small open boat', visibilityM: 20_000, heightM: 10, sweepWidthM: 5_500 },
  ],
};

/** Gives every organisation that never had a sweep-width table the example one; true when one was added. */
export async function seedSweepWidthExamples(db: Sequelize): Promise<boolean> {
  let added = false;
  for (const org of await OrganizationModel.findAll()) {
    if ((await sweepWidthTablesRepository.count(org.id)) > 0) continue;
    await db.transaction((t) => sweepWidthTablesRepository.create(org.id, EXAMPLE_SWEEP_WIDTH_TABLE, t));
    added = true;
  }
  return added;
}
