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

// zod re-exports all of its ~50 message locales as `z.locales` (≈ 270 KB of the first bundle); the app
// uses zod's English messages only, which zod sets up itself. The web bundle gets an English-only namespace.
const zodLocales = path.join(__dirname, 'shared', 'schemas', 'zod-locales-en.js');
const zodApi = /[\\/]node_modules[\\/]zod[\\/]v4[\\/](classic|core|mini)[\\/][^\\/]+$/;
const resolveRequest = config.resolver.resolveRequest;
config.resolver.resolveRequest = (context, moduleName, platform) => {
  if (moduleName === '../locales/index.js' && zodApi.test(context.originModulePath)) {
    return { type: 'sourceFile', filePath: zodLocales };
  }
  return (resolveRequest ?? context.resolveRequest)(context, moduleName, platform);
};

module.exports = config;
