// One jest runner for every suite. Two configs are exported through PARALLAX_JEST_GROUP:
// 'unit' (statistics, reference checks, client; parallel) and 'api' (server, against the real
// PostgreSQL; run in band by the test runner so suites that share the database never race).
const path = require('path');
const root = path.resolve(__dirname, '../..');
const swc = [
  '@swc/jest',
  {
    jsc: { parser: { syntax: 'typescript', decorators: true }, target: 'es2022', transform: { decoratorMetadata: false } },
    module: { type: 'commonjs' },
  },
];
// `@shared/*` (tsconfig.json's one path alias) is the repository's shared/ folder for every runner.
const sharedAlias = { '^@shared/(.*)$': '<rootDir>/shared/$1' };
const nodeProject = (displayName, testMatch) => ({
  displayName,
  rootDir: root,
  testEnvironment: 'node',
  testMatch,
  transform: { '^.+\\.ts$': swc },
  moduleFileExtensions: ['ts', 'js', 'json'],
  moduleNameMapper: sharedAlias,
  testPathIgnorePatterns: ['/node_modules/', '/dist/', '/.data/'],
});

const clientProject = () => {
  const { createCjsPreset } = require('jest-preset-angular/presets');
  const preset = createCjsPreset({ tsconfig: '<rootDir>/tsconfig.spec.json' });
  return {
    ...preset,
    displayName: 'client',
    rootDir: root,
    testMatch: ['<rootDir>/src/**/*.spec.ts'],
    setupFilesAfterEnv: ['<rootDir>/src/test-setup.ts'],
    moduleNameMapper: { ...(preset.moduleNameMapper ?? {}), ...sharedAlias },
    testPathIgnorePatterns: ['/node_modules/', '/dist/'],
  };
};

const fs = require('fs');
const hasClientSpecs = () => {
  const walk = (dir) =>
    fs.existsSync(dir) &&
    fs.readdirSync(dir, { withFileTypes: true }).some((e) =>
      e.isDirectory() ? walk(path.join(dir, e.name)) : e.name.endsWith('.spec.ts'),
    );
  return walk(path.join(root, 'src'));
};

const group = process.env.PARALLAX_JEST_GROUP || 'unit';
const projects =
  group === 'api'
    ? [nodeProject('api', ['<rootDir>/server/**/*.spec.ts'])]
    : [
        nodeProject('stats', ['<rootDir>/shared/**/*.spec.ts']),
        nodeProject('reference', ['<rootDir>/reference-checks/**/*.check.ts']),
        ...(hasClientSpecs() ? [clientProject()] : []),
      ];

module.exports = { rootDir: root, projects, testTimeout: 60000 };
