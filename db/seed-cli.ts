import { databasePath, migrateToLatest, openDatabase } from "./connection";
import { demoAccountsTable, seedDemo } from "./seed";

const db = openDatabase();
await migrateToLatest(db);
const r = await seedDemo(db);
console.log(`seeded ${databasePath()}: band ${r.bandId}, ${r.usersCreated} new accounts, ${r.chartsCreated} new charts`);
console.log(demoAccountsTable());
await db.destroy();
