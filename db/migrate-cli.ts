import { databasePath, migrateToLatest, openDatabase } from "./connection";

const db = openDatabase();
const applied = await migrateToLatest(db);
console.log(applied.length ? `migrated ${databasePath()}: ${applied.join(", ")}` : `${databasePath()} is up to date`);
await db.destroy();
