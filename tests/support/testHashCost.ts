/**
 * Test users' passwords are hashed at bcrypt cost 4, not the app's 12: a sign-in runs the same check at the
 * cost written in the hash, and the suite signs in a few hundred times (each check at cost 12 takes about
 * 0.3 s of CPU). The API harness hashes its users at this cost; scripts/testRun.ts re-hashes the demo users
 * of the test databases with it.
 */
export const TEST_HASH_COST = 4
