// dependency-cruiser: the layers and the no-cycles rule (npm run lint:layers).
//
//   app/ → components/ → lib/<concept>/ → models/ → lib/vocabulary/
//
// Each layer imports only downward; lib/vocabulary (names and labels) imports nothing of ours.
// tests/ and seeders/ sit outside the layers and may import anything. Type-only imports count
// (tsPreCompilationDeps), so a type cannot smuggle an upward dependency in.
/** @type {import('dependency-cruiser').IConfiguration} */
module.exports = {
  forbidden: [
    {
      name: "no-circular",
      severity: "error",
      comment: "An import cycle: the modules in it cannot be understood, tested or loaded one at a time.",
      from: { path: "^(app|components|lib|models)/" },
      to: { circular: true },
    },
    {
      name: "components-not-to-app",
      severity: "error",
      comment: "components/ sits below app/: a type or helper both need belongs in components/ or lib/.",
      from: { path: "^components/" },
      to: { path: "^app/" },
    },
    {
      name: "lib-not-to-app-or-components",
      severity: "error",
      comment: "lib/ sits below app/ and components/: it holds no pages, routes or React components.",
      from: { path: "^lib/" },
      to: { path: "^(app|components)/" },
    },
    {
      name: "models-only-to-vocabulary",
      severity: "error",
      comment: "models/ sits below lib/: of our code it imports only other models and lib/vocabulary.",
      from: { path: "^models/" },
      to: { path: "^(app|components|lib|seeders|tests)/", pathNot: "^lib/vocabulary/" },
    },
    {
      name: "vocabulary-is-a-leaf",
      severity: "error",
      comment: "lib/vocabulary holds names and labels that everything imports, so it imports nothing of ours.",
      from: { path: "^lib/vocabulary/" },
      to: { path: "^(app|components|lib|models|migrations|seeders|tests)/", pathNot: "^lib/vocabulary/" },
    },
    {
      name: "http-kernel-only-to-auth",
      severity: "error",
      comment: "lib/http is the route kernel: it knows the session (lib/auth) and no other concept; concepts own their responses.",
      from: { path: "^lib/http/" },
      to: { path: "^lib/", pathNot: "^lib/(http|auth|vocabulary)/" },
    },
    {
      name: "app-code-not-to-tests-or-seeders",
      severity: "error",
      comment:
        "Application code does not depend on tests or seed data. The launcher (lib/platform) is not application code: it starts the tests and the benchmarks.",
      from: { path: "^(app|components|lib|models)/", pathNot: "^lib/platform/" },
      to: { path: "^(tests|seeders)/" },
    },
  ],
  options: {
    doNotFollow: { path: "node_modules" },
    exclude: { path: "^(\\.next[^/]*|\\.data|tests/artifacts|coverage)/" },
    tsPreCompilationDeps: true,
    tsConfig: { fileName: "tsconfig.json" },
    enhancedResolveOptions: {
      exportsFields: ["exports"],
      conditionNames: ["import", "require", "node", "default", "types"],
      mainFields: ["module", "main", "types", "typings"],
    },
    reporterOptions: {
      text: { highlightFocused: true },
    },
  },
};
