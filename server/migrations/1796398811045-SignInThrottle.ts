import type { MigrationInterface, QueryRunner } from 'typeorm'

/**
 * Sign-in throttle counters in the database, so every app process counts the same failures
 * (rate-limiter-flexible's MySQL store layout: key, points, expiry in epoch milliseconds).
 */
export class SignInThrottle1796398811045 implements MigrationInterface {
  name = 'SignInThrottle1796398811045'

  async up(q: QueryRunner): Promise<void> {
    await q.query(`CREATE TABLE signin_throttle (
      \`key\` VARCHAR(255) CHARACTER SET utf8mb4 COLLATE utf8mb4_bin NOT NULL,
      points INT NOT NULL DEFAULT 0,
      expire BIGINT UNSIGNED NULL,
      PRIMARY KEY (\`key\`)
    ) ENGINE=InnoDB DEFAULT CHARSET=utf8mb4 COLLATE=utf8mb4_unicode_ci`)
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query('DROP TABLE signin_throttle')
  }
}
