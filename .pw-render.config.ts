import base from "./playwright.config";
export default { ...base, webServer: undefined, outputDir: "test-results/e2e-render", use: { ...base.use, baseURL: "http://localhost:3400" } };
