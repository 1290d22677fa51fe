// geotiff's CommonJS build requires quick-lru, which ships only as an ES module that
// Jest's CommonJS runtime cannot load. geotiff uses it for remote sources only, which
// Kenning never opens, so a Map stands in (mapped in jest.config.js for Node projects).
class QuickLRU extends Map {}
module.exports = { __esModule: true, default: QuickLRU };
