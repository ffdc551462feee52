import { defineConfig } from "vitest/config";
import { fileURLToPath } from "node:url";

// Unit and integration tests; browser tests have their own config (vitest.e2e.config.ts).
export default defineConfig({
  resolve: { alias: { "@": fileURLToPath(new URL("./", import.meta.url)) } },
  test: {
    include: ["tests/**/*.test.ts"],
    exclude: ["tests/e2e/**", "tests/bench/**", "node_modules/**"],
    testTimeout: 60_000,
    hookTimeout: 60_000,
  },
});
