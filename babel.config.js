module.exports = function (api) {
  api.cache(true);
  // babel-preset-expo adds the Expo Router and react-native-worklets plugins itself.
  return { presets: ['babel-preset-expo'] };
};
