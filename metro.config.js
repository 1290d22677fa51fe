// Metro's cache lives in the project's ignored .kenning folder, not the system temp folder.
const path = require('node:path');
const { getDefaultConfig } = require('expo/metro-config');
const { FileStore } = require('metro-cache');

const config = getDefaultConfig(__dirname);

config.cacheStores = [new FileStore({ root: path.join(__dirname, '.kenning', 'cache', 'metro') })];
// The server, tests and local data are never part of the app bundle.
const escape = (s) => s.replace(/[.*+?^${}()|[\]\\]/g, '\\$&');
const own = (folder) => new RegExp(`^${escape(path.join(__dirname, folder))}\\/.*`);
config.resolver.blockList = ['.kenning', 'server', 'tests', 'dist'].map(own);

module.exports = config;
