import type { MigrationInterface, QueryRunner } from 'typeorm'

export class Foundation1764633600000 implements MigrationInterface {
  name = 'Foundation1764633600000'

  async up(q: QueryRunner): Promise<void> {
    await q.query(`CREATE TABLE users (
      id INT NOT NULL AUTO_INCREMENT PRIMARY KEY,
      username VARCHAR(40) NOT NULL,
      display_name VARCHAR(80) NOT NULL,
      email VARCHAR(120) NULL,
      password_hash VARCHAR(100) NOT NULL,
      roles VARCHAR(100) NOT NULL,
      active TINYINT(1) NOT NULL DEFAULT 1,
      unit_preference VARCHAR(2) NOT NULL DEFAULT 'in',
      locale VARCHAR(2) NOT NULL DEFAULT 'en',
      session_epoch INT NOT NULL DEFAULT 0,
      last_sign_in_at DATETIME NULL,
      created_at DATETIME NOT NULL DEFAULT CURRENT_TIMESTAMP,
      updated_at DATETIME NOT NULL DEFAULT CURRENT_TIMESTAMP ON UPDATE CURRENT_TIMESTAMP,
      UNIQUE KEY uq_users_username (username)
    ) ENGINE=InnoDB DEFAULT CHARSET=utf8mb4 COLLATE=utf8mb4_unicode_ci`)
    await q.query(`CREATE TABLE audit_entries (
      id BIGINT NOT NULL AUTO_INCREMENT PRIMARY KEY,
      at DATETIME(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
      user_id INT NULL,
      action VARCHAR(60) NOT NULL,
      entity VARCHAR(40) NOT NULL,
      entity_id VARCHAR(40) NULL,
      detail TEXT NULL,
      ip VARCHAR(45) NULL,
      KEY ix_audit_entity (entity, entity_id),
      KEY ix_audit_at (at)
    ) ENGINE=InnoDB DEFAULT CHARSET=utf8mb4 COLLATE=utf8mb4_unicode_ci`)
    // Session rows for express-mysql-session (its own schema, created here so the app user needs no DDL at run time).
    await q.query(`CREATE TABLE sessions (
      session_id VARCHAR(128) COLLATE utf8mb4_bin NOT NULL PRIMARY KEY,
      expires INT UNSIGNED NOT NULL,
      data MEDIUMTEXT COLLATE utf8mb4_bin,
      KEY ix_sessions_expires (expires)
    ) ENGINE=InnoDB`)
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query('DROP TABLE sessions')
    await q.query('DROP TABLE audit_entries')
    await q.query('DROP TABLE users')
  }
}
