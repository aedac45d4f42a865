// Metro configuration for the web export.
// zod 4 re-exports all of its ~250 locales from one index; the app only speaks English, so the
// locale index is pointed at English alone (about 90 KB less gzipped JS).
const path = require('path');
const { getDefaultConfig } = require('expo/metro-config');

const config = getDefaultConfig(__dirname);
const upstream = config.resolver.resolveRequest;
const ZOD_INTERNAL = /[\\/]zod[\\/]v4[\\/](classic|core)[\\/]/;

config.resolver.resolveRequest = (context, moduleName, platform) => {
  if (moduleName === '../locales/index.js' && ZOD_INTERNAL.test(context.originModulePath)) {
    return { type: 'sourceFile', filePath: path.join(__dirname, 'lib', 'zod-locales-en.js') };
  }
  return (upstream ?? context.resolveRequest)(context, moduleName, platform);
};

module.exports = config;
