// StrykerJS: mutation testing of the engine and the service layer (`npm run mutate`, not part of npm test).
// MUTATE picks one area, so a run fits on a shared machine:
//   MUTATE=engine/uncertainty npm run mutate      (a folder of api/engine/, with that folder's specs)
//   MUTATE=engine npm run mutate                  (all of api/engine/; the slow bootstrap specs included)
//   MUTATE=service/board npm run mutate           (api/board/board.service.ts with the server specs that drive it)
// The report lands in .data/mutation/<area>.html and a one-line score on stdout.
const area = process.env.MUTATE ?? 'engine';
const name = area.replace(/[^a-z0-9]+/gi, '-');

/** Server specs that exercise each service (they need the test database: see DEVELOPERS.md). */
const SERVICE_SPECS = {
  board: ['test/api/board.spec.ts', 'test/api/decision-transaction.spec.ts'],
  advisories: ['test/api/board.spec.ts', 'test/api/advisory-mail.spec.ts'],
  proposals: ['test/api/proposals.spec.ts'],
  runs: ['test/api/runs.spec.ts'],
  datasets: ['test/api/datasets.spec.ts'],
  subscriptions: ['test/api/subscriptions.spec.ts'],
  users: ['test/api/users.spec.ts'],
  audit: ['test/api/users.spec.ts', 'test/api/board.spec.ts'],
};

function plan() {
  if (area === 'engine') {
    return { mutate: ['api/engine/**/*.ts', '!api/engine/**/*.spec.ts', '!api/engine/bench/**', '!api/engine/cli/**', '!api/engine/types/**', '!api/engine/**/*-worker.ts'], specs: ['api/engine/**/*.spec.ts'] };
  }
  if (area.startsWith('engine/')) {
    const dir = `api/${area}`;
    return { mutate: [`${dir}/**/*.ts`, `!${dir}/**/*.spec.ts`, `!${dir}/**/*-worker.ts`], specs: [`${dir}/**/*.spec.ts`, ...extraEngineSpecs(area)] };
  }
  if (area.startsWith('service/')) {
    const feature = area.slice('service/'.length);
    const specs = SERVICE_SPECS[feature];
    if (!specs) throw new Error(`MUTATE=${area}: no specs listed for the ${feature} service in test/mutation/stryker.config.mjs`);
    return { mutate: [`api/${feature}/*.service.ts`, `api/${feature}/*.publisher.ts`], specs };
  }
  throw new Error(`MUTATE=${area}: expected engine, engine/<folder> or service/<feature>`);
}

/** Specs elsewhere in the engine that are the main check of a folder (a folder's maths is often checked where it is used). */
function extraEngineSpecs(a) {
  return {
    'engine/numerics': ['api/engine/surplus/logistic-harvest.spec.ts', 'api/engine/surplus/surplus.spec.ts', 'api/engine/linked/predator-prey.spec.ts'],
    'engine/uncertainty': ['api/engine/projection/*.spec.ts'],
    'engine/projection': [],
    'engine/surplus': ['api/engine/projection/*.spec.ts'],
  }[a] ?? [];
}

const { mutate, specs } = plan();
process.env.STRYKER_SPECS = JSON.stringify(specs);

export default {
  packageManager: 'npm',
  testRunner: 'jasmine',
  jasmineConfigFile: 'test/mutation/jasmine.mutation.mjs',
  testRunnerNodeArgs: ['--import', 'tsx'],
  checkers: ['typescript'],
  // the engine is checked alone (faster on a shared machine); services need the whole server
  tsconfigFile: area.startsWith('engine') ? 'test/mutation/tsconfig.engine.json' : 'tsconfig.api.json',
  typescriptChecker: { prioritizePerformanceOverAccuracy: true },
  coverageAnalysis: 'perTest',
  ignoreStatic: true,
  mutate,
  concurrency: Number(process.env.MUTATE_CONCURRENCY ?? 2),
  timeoutMS: 60_000,
  tempDirName: '.data/stryker-tmp',
  ignorePatterns: ['dist', '.data', '.angular', 'src', 'test/e2e', '*.png'],
  reporters: ['clear-text', 'html', 'json', 'progress-append-only'],
  htmlReporter: { fileName: `.data/mutation/${name}.html` },
  jsonReporter: { fileName: `.data/mutation/${name}.json` },
  clearTextReporter: { allowColor: false, logTests: false, maxTestsToLog: 0 },
  thresholds: { high: 85, low: 75, break: null },
};
