import type { MigrationInterface, QueryRunner } from 'typeorm'

const TABLE = 'ENGINE=InnoDB DEFAULT CHARSET=utf8mb4 COLLATE=utf8mb4_unicode_ci'

/**
 * What an admin tunes in the takeoff: changed or added material rules, waste allowances per family, and
 * which catalog item fills each material role (for any block or one block, for either joint system or one);
 * and the snapshot each saved bill was computed from.
 */
export class CounterTakeoffSettings1764770000000 implements MigrationInterface {
  name = 'CounterTakeoffSettings1764770000000'

  async up(q: QueryRunner): Promise<void> {
    await q.query(`CREATE TABLE material_rules (
      id INT NOT NULL AUTO_INCREMENT PRIMARY KEY,
      rule_key VARCHAR(60) NOT NULL,
      rule_json TEXT NOT NULL,
      enabled TINYINT(1) NOT NULL DEFAULT 1,
      updated_by INT NULL,
      updated_at DATETIME NOT NULL DEFAULT CURRENT_TIMESTAMP ON UPDATE CURRENT_TIMESTAMP,
      UNIQUE KEY uq_material_rules_key (rule_key)
    ) ${TABLE}`)
    await q.query(`CREATE TABLE waste_allowances (
      family VARCHAR(20) NOT NULL PRIMARY KEY,
      pct DECIMAL(5,2) NOT NULL,
      updated_by INT NULL,
      updated_at DATETIME NOT NULL DEFAULT CURRENT_TIMESTAMP ON UPDATE CURRENT_TIMESTAMP,
      CONSTRAINT ck_waste_pct CHECK (pct >= 0 AND pct <= 100)
    ) ${TABLE}`)
    await q.query(`CREATE TABLE material_role_items (
      id INT NOT NULL AUTO_INCREMENT PRIMARY KEY,
      role VARCHAR(20) NOT NULL,
      joint_kind VARCHAR(10) NULL,
      block_item_id INT NULL,
      item_id INT NOT NULL,
      piece_length_mm DECIMAL(10,2) NULL,
      yield_ml DECIMAL(12,2) NULL,
      note VARCHAR(200) NULL,
      joint_key VARCHAR(10) AS (IFNULL(joint_kind, '')) PERSISTENT,
      block_key INT AS (IFNULL(block_item_id, 0)) PERSISTENT,
      updated_by INT NULL,
      updated_at DATETIME NOT NULL DEFAULT CURRENT_TIMESTAMP ON UPDATE CURRENT_TIMESTAMP,
      UNIQUE KEY uq_role_items (role, joint_key, block_key),
      KEY ix_role_items_item (item_id),
      CONSTRAINT fk_role_items_item FOREIGN KEY (item_id) REFERENCES items(id),
      CONSTRAINT fk_role_items_block FOREIGN KEY (block_item_id) REFERENCES items(id),
      CONSTRAINT ck_role_items_joint CHECK (joint_kind IS NULL OR joint_kind IN ('spacer', 'mortar')),
      CONSTRAINT ck_role_items_sizes CHECK ((piece_length_mm IS NULL OR piece_length_mm > 0) AND (yield_ml IS NULL OR yield_ml > 0))
    ) ${TABLE}`)
    // What a saved bill was computed from (the takeoff bound to its items) and each wall's layout and
    // drawing, so the bill shows the same drawing later even if the takeoff or the catalog changes.
    await q.query(`CREATE TABLE bom_snapshots (
      bom_id INT NOT NULL PRIMARY KEY,
      unit VARCHAR(2) NOT NULL,
      input_json MEDIUMTEXT NOT NULL,
      walls_json MEDIUMTEXT NOT NULL,
      CONSTRAINT fk_bom_snapshots_bom FOREIGN KEY (bom_id) REFERENCES boms(id)
    ) ${TABLE}`)
  }

  async down(q: QueryRunner): Promise<void> {
    for (const t of ['bom_snapshots', 'material_role_items', 'waste_allowances', 'material_rules']) await q.query(`DROP TABLE ${t}`)
  }
}
