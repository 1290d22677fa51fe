/**
 * Every react-three-fiber scene, behind one module so that the lazy imports of
 * the 3D views share one async chunk. Metro's web export moves modules that two
 * async chunks have in common into `__common`, which index.html loads up front:
 * with one import per scene, three.js landed in the first load of every page.
 */
export { default as SightlineScene } from './sightline/sightline-scene';
export { default as TerrainScene } from './terrain/terrain-scene';
