import { defineConfig } from "vitest/config";
import { fileURLToPath } from "node:url";

// Browser and HTTP tests against a running, built app (E2E_BASE_URL); one file at a time,
// because they share the server and its database.
export default defineConfig({
  resolve: { alias: { "@": fileURLToPath(new URL("./", import.meta.url)) } },
  test: {
    include: ["tests/e2e/**/*.e2e.test.ts"],
    fileParallelism: false,
    testTimeout: 90_000,
    hookTimeout: 120_000,
  },
});
