// Jasmine configuration for StrykerJS runs: the specs chosen by test/mutation/stryker.config.mjs.
export default {
  spec_dir: '.',
  spec_files: JSON.parse(process.env.STRYKER_SPECS ?? '["api/engine/**/*.spec.ts"]'),
  helpers: ['test/helpers/timeouts.ts'],
  jsLoader: 'import',
  env: { random: false, stopSpecOnExpectationFailure: false },
};
