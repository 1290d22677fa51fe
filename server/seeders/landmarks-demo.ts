import type { Sequelize } from 'sequelize';
import { fromUtm } from '@/shared/geo/from-utm';
import { LandmarkModel, SiteModel } from '@/server/data/models';

/** Invented reference marks in the demo forest district (UTM zone 33N metres on the demo terrain). */
export const DEMO_LANDMARKS = [
  { name: 'Tarnwick Fire Hut', easting: 518_400, northing: 5_738_900, heightM: 5, note: 'Timber hut by the tarn; red roof.' },
  { name: 'Owlstone Cairn', easting: 521_700, northing: 5_742_600, heightM: 2, note: 'Summit cairn on the bare top.' },
  { name: 'Marrow Fen Mast', easting: 517_300, northing: 5_734_800, heightM: 40, note: 'Radio mast, lit at night.' },
] as const;

/** Adds the demo landmarks to the demo forest district once (nothing when it already has landmarks). */
export async function seedDemoLandmarks(db: Sequelize, siteName = 'Harrowmere Forest District'): Promise<boolean> {
  return db.transaction(async (transaction) => {
    const site = await SiteModel.findOne({ where: { name: siteName }, transaction });
    if (!site) return false;
    if ((await LandmarkModel.count({ where: { siteId: site.id }, transaction })) > 0) return false;
    for (const m of DEMO_LANDMARKS) {
      const p = fromUtm({ zone: 33, hemisphere: 'N', easting: m.easting, northing: m.northing });
      await LandmarkModel.create(
        {
          organizationId: site.organizationId,
          siteId: site.id,
          name: m.name,
          latDeg: p.latDeg,
          lonDeg: p.lonDeg,
          heightM: m.heightM,
          note: m.note,
        },
        { transaction },
      );
    }
    return true;
  });
}
