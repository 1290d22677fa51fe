/*
 * The terrain use cases of a site, one module each: upload (ingest in a worker, store, activate),
 * the active terrain and its hillshade, elevation at a point, the terrain profile and the 3D mesh.
 */
export type { TerrainDeps, TerrainUpload } from './terrain-deps';
export { toSiteTerrain } from './to-site-terrain';
export { uploadTerrain } from './upload-terrain';
export { getActiveTerrain, openHillshade } from './active-terrain';
export { terrainElevation } from './terrain-elevation';
export { profileTerrain } from './profile-terrain';
export { terrainMesh } from './terrain-mesh';
