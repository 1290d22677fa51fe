// Reanimated 4 runs on react-native-worklets, which needs its mock under Jest.
jest.mock('react-native-worklets', () => require('react-native-worklets/src/mock'));
