// Reanimated 4 runs on react-native-worklets, which needs its mock under Jest.
jest.mock('react-native-worklets', () => require('react-native-worklets/src/mock'));

// The first screens' response schemas come with the deferred chunk in the app (a bundling matter); here they
// load on their own, without evaluating every deferred screen on each test's first request.
jest.mock('@/components/data/deferred-chunk', () => ({
  ...jest.requireActual('@/components/data/deferred-chunk'),
  loadFirstScreenSchemas: async () => require('@/components/data/first-screen-schemas'),
}));
