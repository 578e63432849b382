import type { MigrationInterface, QueryRunner } from 'typeorm'

const TABLE = 'ENGINE=InnoDB DEFAULT CHARSET=utf8mb4 COLLATE=utf8mb4_unicode_ci'

export class StockCore1764700000000 implements MigrationInterface {
  name = 'StockCore1764700000000'

  async up(q: QueryRunner): Promise<void> {
    await q.query(`CREATE TABLE items (
      id INT NOT NULL AUTO_INCREMENT PRIMARY KEY,
      sku VARCHAR(40) NOT NULL,
      name VARCHAR(120) NOT NULL,
      family VARCHAR(20) NOT NULL,
      stock_unit VARCHAR(10) NOT NULL,
      case_qty INT NULL,
      pallet_qty INT NULL,
      sell_by_pack TINYINT(1) NOT NULL DEFAULT 0,
      gtin VARCHAR(14) NULL,
      weight_kg DECIMAL(10,3) NOT NULL DEFAULT 0,
      cost DECIMAL(12,4) NOT NULL DEFAULT 0,
      list_price DECIMAL(12,2) NOT NULL DEFAULT 0,
      active TINYINT(1) NOT NULL DEFAULT 1,
      made_to_order TINYINT(1) NOT NULL DEFAULT 0,
      match_lot TINYINT(1) NOT NULL DEFAULT 0,
      nominal_size VARCHAR(16) NULL,
      face_width_mm DECIMAL(8,2) NULL,
      face_height_mm DECIMAL(8,2) NULL,
      depth_mm DECIMAL(8,2) NULL,
      thickness_class VARCHAR(10) NULL,
      pattern VARCHAR(30) NULL,
      shape VARCHAR(30) NULL,
      cartridge_ml DECIMAL(8,2) NULL,
      grout_yield_ml DECIMAL(10,2) NULL,
      joint_mm DECIMAL(6,3) NULL,
      description TEXT NULL,
      created_at DATETIME NOT NULL DEFAULT CURRENT_TIMESTAMP,
      updated_at DATETIME NOT NULL DEFAULT CURRENT_TIMESTAMP ON UPDATE CURRENT_TIMESTAMP,
      UNIQUE KEY uq_items_sku (sku),
      UNIQUE KEY uq_items_gtin (gtin),
      KEY ix_items_family (family),
      CONSTRAINT ck_items_packs CHECK ((case_qty IS NULL OR case_qty > 0) AND (pallet_qty IS NULL OR pallet_qty > 0))
    ) ${TABLE}`)
    await q.query(`CREATE TABLE warehouses (
      id INT NOT NULL AUTO_INCREMENT PRIMARY KEY,
      code VARCHAR(12) NOT NULL,
      name VARCHAR(80) NOT NULL,
      address VARCHAR(200) NULL,
      bin_pattern VARCHAR(120) NOT NULL DEFAULT '^(?<aisle>[A-Z]+)-(?<bay>\\\\d+)-(?<level>\\\\d+)$',
      aisle_order VARCHAR(200) NOT NULL DEFAULT '',
      walk_direction VARCHAR(12) NOT NULL DEFAULT 'serpentine',
      active TINYINT(1) NOT NULL DEFAULT 1,
      UNIQUE KEY uq_warehouses_code (code)
    ) ${TABLE}`)
    await q.query(`CREATE TABLE bins (
      id INT NOT NULL AUTO_INCREMENT PRIMARY KEY,
      warehouse_id INT NOT NULL,
      code VARCHAR(32) NOT NULL,
      kind VARCHAR(12) NOT NULL DEFAULT 'storage',
      active TINYINT(1) NOT NULL DEFAULT 1,
      UNIQUE KEY uq_bins_code (warehouse_id, code),
      CONSTRAINT fk_bins_warehouse FOREIGN KEY (warehouse_id) REFERENCES warehouses(id)
    ) ${TABLE}`)
    await q.query(`CREATE TABLE vendors (
      id INT NOT NULL AUTO_INCREMENT PRIMARY KEY,
      code VARCHAR(20) NOT NULL,
      name VARCHAR(120) NOT NULL,
      contact_name VARCHAR(80) NULL,
      email VARCHAR(120) NULL,
      phone VARCHAR(40) NULL,
      address VARCHAR(200) NULL,
      terms VARCHAR(40) NULL,
      currency CHAR(3) NOT NULL DEFAULT 'USD',
      lead_time_days INT NOT NULL DEFAULT 14,
      active TINYINT(1) NOT NULL DEFAULT 1,
      created_at DATETIME NOT NULL DEFAULT CURRENT_TIMESTAMP,
      UNIQUE KEY uq_vendors_code (code)
    ) ${TABLE}`)
    await q.query(`CREATE TABLE vendor_items (
      id INT NOT NULL AUTO_INCREMENT PRIMARY KEY,
      vendor_id INT NOT NULL,
      item_id INT NOT NULL,
      vendor_sku VARCHAR(40) NOT NULL,
      pack_qty INT NOT NULL DEFAULT 1,
      min_order_qty INT NOT NULL DEFAULT 1,
      unit_cost DECIMAL(12,4) NOT NULL,
      lead_time_days INT NULL,
      preferred TINYINT(1) NOT NULL DEFAULT 0,
      UNIQUE KEY uq_vendor_items (vendor_id, item_id),
      KEY ix_vendor_items_item (item_id),
      CONSTRAINT fk_vendor_items_vendor FOREIGN KEY (vendor_id) REFERENCES vendors(id),
      CONSTRAINT fk_vendor_items_item FOREIGN KEY (item_id) REFERENCES items(id),
      CONSTRAINT ck_vendor_items_qty CHECK (pack_qty > 0 AND min_order_qty > 0)
    ) ${TABLE}`)
    await q.query(`CREATE TABLE lots (
      id INT NOT NULL AUTO_INCREMENT PRIMARY KEY,
      item_id INT NOT NULL,
      code VARCHAR(20) NOT NULL,
      received_at DATE NOT NULL,
      vendor_id INT NULL,
      tint_note VARCHAR(120) NULL,
      created_at DATETIME NOT NULL DEFAULT CURRENT_TIMESTAMP,
      UNIQUE KEY uq_lots_code (item_id, code),
      CONSTRAINT fk_lots_item FOREIGN KEY (item_id) REFERENCES items(id),
      CONSTRAINT fk_lots_vendor FOREIGN KEY (vendor_id) REFERENCES vendors(id)
    ) ${TABLE}`)
    await q.query(`CREATE TABLE stock_balances (
      id INT NOT NULL AUTO_INCREMENT PRIMARY KEY,
      item_id INT NOT NULL,
      warehouse_id INT NOT NULL,
      bin_id INT NOT NULL,
      lot_id INT NULL,
      lot_key INT AS (IFNULL(lot_id, 0)) PERSISTENT,
      on_hand INT NOT NULL DEFAULT 0,
      reserved INT NOT NULL DEFAULT 0,
      updated_at DATETIME NOT NULL DEFAULT CURRENT_TIMESTAMP ON UPDATE CURRENT_TIMESTAMP,
      UNIQUE KEY uq_balance (item_id, bin_id, lot_key),
      KEY ix_balance_item_wh (item_id, warehouse_id),
      KEY ix_balance_bin (bin_id),
      CONSTRAINT fk_balance_item FOREIGN KEY (item_id) REFERENCES items(id),
      CONSTRAINT fk_balance_wh FOREIGN KEY (warehouse_id) REFERENCES warehouses(id),
      CONSTRAINT fk_balance_bin FOREIGN KEY (bin_id) REFERENCES bins(id),
      CONSTRAINT fk_balance_lot FOREIGN KEY (lot_id) REFERENCES lots(id),
      CONSTRAINT ck_balance_qty CHECK (on_hand >= 0 AND reserved >= 0 AND reserved <= on_hand)
    ) ${TABLE}`)
    await q.query(`CREATE TABLE stock_moves (
      id BIGINT NOT NULL AUTO_INCREMENT PRIMARY KEY,
      at DATETIME(3) NOT NULL,
      move_type VARCHAR(16) NOT NULL,
      item_id INT NOT NULL,
      warehouse_id INT NOT NULL,
      bin_id INT NOT NULL,
      lot_id INT NULL,
      qty INT NOT NULL,
      unit_cost DECIMAL(12,4) NULL,
      doc_type VARCHAR(20) NULL,
      doc_id INT NULL,
      doc_line_id INT NULL,
      reason VARCHAR(20) NULL,
      note VARCHAR(200) NULL,
      batch_id CHAR(36) NOT NULL,
      user_id INT NULL,
      KEY ix_moves_item_wh_at (item_id, warehouse_id, at),
      KEY ix_moves_type_at (move_type, at, item_id, warehouse_id, qty),
      KEY ix_moves_doc (doc_type, doc_id),
      KEY ix_moves_at (at),
      KEY ix_moves_batch (batch_id),
      CONSTRAINT ck_moves_qty CHECK (qty <> 0)
    ) ${TABLE}`)
    await q.query(`CREATE TABLE stock_reservations (
      id INT NOT NULL AUTO_INCREMENT PRIMARY KEY,
      balance_id INT NOT NULL,
      item_id INT NOT NULL,
      warehouse_id INT NOT NULL,
      bin_id INT NOT NULL,
      lot_id INT NULL,
      qty INT NOT NULL,
      doc_type VARCHAR(20) NOT NULL,
      doc_id INT NOT NULL,
      doc_line_id INT NULL,
      user_id INT NULL,
      created_at DATETIME NOT NULL DEFAULT CURRENT_TIMESTAMP,
      KEY ix_reservations_doc (doc_type, doc_id),
      KEY ix_reservations_balance (balance_id),
      CONSTRAINT fk_reservations_balance FOREIGN KEY (balance_id) REFERENCES stock_balances(id),
      CONSTRAINT ck_reservations_qty CHECK (qty > 0)
    ) ${TABLE}`)
    await q.query(`CREATE TABLE item_warehouses (
      item_id INT NOT NULL,
      warehouse_id INT NOT NULL,
      avg_cost DECIMAL(14,4) NOT NULL DEFAULT 0,
      min_qty INT NULL,
      PRIMARY KEY (item_id, warehouse_id),
      CONSTRAINT fk_iw_item FOREIGN KEY (item_id) REFERENCES items(id),
      CONSTRAINT fk_iw_wh FOREIGN KEY (warehouse_id) REFERENCES warehouses(id),
      CONSTRAINT ck_iw_min CHECK (min_qty IS NULL OR min_qty >= 0)
    ) ${TABLE}`)
    await q.query(`CREATE TABLE transfers (
      id INT NOT NULL AUTO_INCREMENT PRIMARY KEY,
      from_warehouse_id INT NOT NULL,
      to_warehouse_id INT NOT NULL,
      status VARCHAR(12) NOT NULL DEFAULT 'in_transit',
      note VARCHAR(200) NULL,
      shipped_by INT NULL,
      shipped_at DATETIME NOT NULL DEFAULT CURRENT_TIMESTAMP,
      received_by INT NULL,
      received_at DATETIME NULL,
      KEY ix_transfers_to (to_warehouse_id, status),
      CONSTRAINT fk_transfers_from FOREIGN KEY (from_warehouse_id) REFERENCES warehouses(id),
      CONSTRAINT fk_transfers_to FOREIGN KEY (to_warehouse_id) REFERENCES warehouses(id)
    ) ${TABLE}`)
    await q.query(`CREATE TABLE transfer_lines (
      id INT NOT NULL AUTO_INCREMENT PRIMARY KEY,
      transfer_id INT NOT NULL,
      item_id INT NOT NULL,
      lot_id INT NULL,
      from_bin_id INT NOT NULL,
      qty INT NOT NULL,
      received_qty INT NOT NULL DEFAULT 0,
      CONSTRAINT fk_transfer_lines_transfer FOREIGN KEY (transfer_id) REFERENCES transfers(id),
      CONSTRAINT ck_transfer_lines_qty CHECK (qty > 0 AND received_qty >= 0 AND received_qty <= qty)
    ) ${TABLE}`)
    await q.query(`CREATE TABLE idempotency_records (
      user_id INT NOT NULL,
      idem_key VARCHAR(100) NOT NULL,
      scope VARCHAR(120) NOT NULL,
      request_hash CHAR(64) NOT NULL,
      response_status INT NOT NULL,
      response_body MEDIUMTEXT NOT NULL,
      created_at DATETIME NOT NULL DEFAULT CURRENT_TIMESTAMP,
      PRIMARY KEY (user_id, idem_key)
    ) ${TABLE}`)
  }

  async down(q: QueryRunner): Promise<void> {
    for (const t of [
      'idempotency_records', 'transfer_lines', 'transfers', 'item_warehouses', 'stock_reservations',
      'stock_moves', 'stock_balances', 'lots', 'vendor_items', 'vendors', 'bins', 'warehouses', 'items',
    ]) {
      await q.query(`DROP TABLE ${t}`)
    }
  }
}
