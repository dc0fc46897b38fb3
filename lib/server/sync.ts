import "server-only";
// Delta sync between the server's book and each device's local copy (DESIGN.md §4).
// Pull: lib/server/sync-pull.ts; push: lib/server/sync-push.ts (its MUTATION_HANDLERS table takes new kinds).
export { pullChanges } from "./sync-pull";
export { pushMutations, MUTATION_HANDLERS, type MutationHandler, type PushContext } from "./sync-push";
export { loadCharts, HISTORY_LIMIT } from "./sync-rows";
