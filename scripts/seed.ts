// Seeds the demo museum into DATABASE_URL: `npx tsx scripts/seed.ts [--if-empty]`.
// Safe to repeat: rows that already exist are left as they are.
import { createDb, databaseUrl } from "../db/index";
import { seedDemoMuseum } from "../db/seed/index";

const db = createDb(databaseUrl(), { max: 1 });
try {
  const report = await seedDemoMuseum(db, { ifEmpty: process.argv.includes("--if-empty"), postPlans: true });
  if (report === null) {
    console.error("seed: the database already has users; left as it is");
  } else {
    const added = Object.entries(report)
      .filter(([, count]) => count > 0)
      .map(([kind, count]) => `${count} ${kind}`);
    console.error(added.length ? `seed: added ${added.join(", ")}` : "seed: the demo museum is already complete");
  }
} catch (error) {
  console.error(`seed: ${error instanceof Error ? error.message : String(error)}`);
  process.exitCode = 1;
} finally {
  await db.destroy();
}
