// Stands in for @stdlib/assert-has-generator-support in the browser bundle (ui/vite.config.ts).
// The original probes for `function*` by calling eval, which the app's Content-Security-Policy
// (script-src 'self', no 'unsafe-eval') reports as a violation; every browser the ui supports has
// generators, so the answer is known without asking. CommonJS like the module it replaces, whose
// callers require() it and call the export directly.
module.exports = function hasGeneratorSupport() {
  return true;
};
