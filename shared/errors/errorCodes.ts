// Every error the server can answer and every problem a form can show has a stable code here, with
// the names of the values its message needs. The words live in the client's message files
// (src/i18n/en/errors.ts and src/i18n/es/errors.ts, one message per code); a test fails when a code
// has no message in either language or a message uses a value not listed here.
// Any code may also carry `unit` (see MeasureUnit): the client then shows min, max and value in the
// user's unit (a length in inches or millimetres).
import type { LengthParseCode } from '../units.js'

export const ERROR_CODES = {
  // Form fields (from the shared zod schemas, see zodProblems.ts)
  required: [],
  enter_number: [],
  whole_number: [],
  at_least: ['min'],
  more_than: ['min'],
  at_most: ['max'],
  less_than: ['max'],
  too_short: ['min'],
  too_long: ['max'],
  too_few: ['min'],
  too_many_items: ['max'],
  not_multiple: ['divisor'],
  invalid_choice: [],
  invalid_email: [],
  invalid_date: [],
  invalid_format: [],
  invalid_value: [],
  unknown_fields: ['keys'],
  not_negative: [],
  more_than_zero: [],
  not_zero: [],
  yes_or_no: [],
  decimal_places: ['places'],
  cost_format: [],
  price_format: [],
  weight_format: [],
  amount_format: [],
  ends_before_start: [],
  range_backwards: [],
  time_zone_unknown: [],
  day_after_today: ['today'],
  audit_export_too_large: ['count', 'max'],
  period_too_long: ['max'],

  // Codes and identifiers typed into forms
  username_chars: [],
  password_unchanged: [],
  customer_code_chars: [],
  vendor_code_chars: [],
  currency_code: [],
  lot_code_chars: [],
  bin_code_chars: [],
  aisle_letter: [],
  aisle_order_format: [],
  pattern_chars: [],
  sku_chars: [],
  sku_like_gtin: [],
  check_digit_wrong: ['label', 'expected', 'actual'],
  gtin_digits_only: [],
  gtin_length: ['length'],
  sscc_digits_only: [],
  sscc_length: ['length'],
  bin_pattern_invalid: [],
  bin_pattern_anchors: [],
  bin_pattern_groups: ['missing'],
  bin_pattern_empty_match: [],
  bin_range_too_big: ['max'],

  // Catalog items
  pallet_whole_cases: ['caseQty'],
  case_qty_needed: [],
  block_field_required: [],
  standard_block_too_thin: ['min'],
  thin_block_too_thin: ['min'],
  made_to_order_no_lots: [],

  // Stock, picking and receiving forms
  found_adds_units: [],
  loss_removes_units: [],
  change_too_large: ['max'],
  transfer_source_needed: [],
  substitute_needed: [],
  one_choice_per_line: [],
  item_or_bin_needed: [],
  minimum_qty: [],
  qty_or_short: [],
  scan_item: [],
  enter_what_arrived: [],
  damage_reason_needed: [],

  // Reorder policies
  required_for_scope: [],
  global_policy_only: [],
  override_item_only: [],
  override_reason_needed: [],
  abc_cutoffs_order: [],

  // Takeoffs
  outside_joint_too_narrow: [],
  arc_one_measure: [],
  opening_height_needed: [],
  courses_needed: [],
  opening_length_needed: [],
  blocks_across_needed: [],
  drain_outside_footprint: [],
  section_sizes_order: [],

  // Requests, sessions and access
  invalid_input: [],
  invalid_filters: [],
  route_not_found: [],
  bad_json: [],
  too_large: [],
  file_too_large: [],
  bad_upload: [],
  csrf: [],
  unauthenticated: [],
  session_ended: [],
  forbidden: [],
  bad_credentials: [],
  too_many_signins_account: ['minutes'],
  too_many_signins_device: ['minutes'],
  internal: [],
  db_unavailable: [],
  network: [],
  idempotency_key_invalid: [],
  idempotency_key_required: [],
  idempotency_key_reused: [],
  idempotency_in_progress: [],

  // Records that must be unique
  username_taken: [],
  customer_code_taken: [],
  vendor_code_taken: [],
  vendor_item_exists: [],
  warehouse_code_taken: [],
  bin_code_taken: [],
  gtin_taken: [],
  sku_taken: [],
  role_mapping_exists: [],

  // Uploads and imported sheets
  file_missing: [],
  file_empty: [],
  file_type_not_allowed: ['name', 'allowed'],
  file_not_xlsx: [],
  csv_binary: [],
  csv_not_utf8: [],
  csv_open_quote: ['row'],
  xlsx_damaged: [],
  archive_too_many_parts: ['max'],
  archive_too_big: ['mb'],
  archive_packed_too_tight: ['ratio'],
  sheet_empty: [],
  sheet_columns: ['missing', 'unknown'],
  sheet_too_many_rows: ['max'],
  sheet_too_many_columns: ['row', 'max'],
  sheet_unreadable: [],
  sheet_timeout: [],
  sheet_too_big: [],
  items_file_empty: [],
  price_list_empty: [],
  takeoff_file_empty: [],
  cell_whole_number: ['text'],
  cell_number: ['text'],
  cell_yes_no: ['text'],
  cell_choice_needed: ['options'],
  cell_choice: ['options', 'text'],
  sku_repeated: ['sku', 'row'],
  gtin_repeated: ['gtin', 'row'],
  gtin_belongs_to: ['gtin', 'sku'],
  sku_not_in_catalog: ['sku'],
  block_sku_needed: [],
  block_not_in_catalog: ['sku'],
  wall_row_differs: ['row'],
  row_wall_and_item: [],
  row_wall_or_item: [],
  length_empty: ['input'],
  length_negative: ['input'],
  length_zero_denominator: ['input'],
  length_decimal_comma: ['input'],
  length_unreadable: ['input'],

  // Warehouses, bins and takeoff settings
  warehouse_not_found: [],
  bin_not_found: [],
  item_not_found: [],
  transit_bin_fixed: [],
  bin_stocked: ['bin', 'units'],
  bin_pattern_misfits: ['bins', 'more'],
  bin_code_misfit: ['code', 'warehouse'],
  bin_used: [],
  lot_required: [],
  rule_id_mismatch: [],
  rule_as_shipped: [],
  rule_not_found: [],
  role_mapping_not_found: [],
  block_role_is_wall: [],
  role_family_mismatch: ['sku', 'family', 'families'],
  piece_length_needed: [],
  bag_yield_needed: [],
  not_a_glass_block: [],

  // Cycle counts and devices
  device_id_invalid: [],
  count_busy: [],

  // Cycle counts
  count_not_found: [],
  count_not_open: ['countStatus'],
  count_scan_not_bin: [],
  count_bin_unknown: ['bin'],
  count_bin_not_in_count: [],
  count_bin_done: ['bin'],
  count_bin_taken: ['who'],
  count_bin_not_started: [],
  count_item_not_asked: ['sku'],
  count_line_settled: ['sku', 'lot'],
  count_reviewer_role: [],
  count_self_approval: ['line'],
  count_line_not_counted: ['line'],
  count_line_stale: ['line'],
  count_decision_twice: [],
  count_line_not_in_count: ['line'],
  warehouse_inactive: ['warehouse'],
  count_aisle_empty: ['warehouse', 'aisle'],
  count_bin_not_in_warehouse: ['n', 'warehouse'],
  count_nothing_due: [],
  count_no_bins: ['warehouse'],

  // Purchase orders, their mail and suggestions; picking discards
  value_out_of_range: [],
  po_not_found: [],
  po_changed: ['number'],
  company_profile_missing: [],
  ship_to_needed: [],
  po_not_sendable: ['poStatus'],
  vendor_email_missing: [],
  message_not_found: [],
  message_was_sent: [],
  message_without_order: [],
  already_sent_again: [],
  suggestion_not_found: [],
  suggestion_ordered: [],
  suggestion_dismissed: [],
  order_total_too_large: ['total', 'max'],
  order_total_at_most: ['max'],
  line_too_large: [],
  line_units_at_most: ['max'],
  confirmation_key_invalid: [],
  discard_note_needed: [],

  // Takeoff limits and computation; bills behind pick lists
  takeoff_too_large: [],
  wall_too_large: ['blocks', 'across', 'courses', 'limit'],
  takeoff_blocks_over: ['blocks', 'limit'],
  compute_busy: [],
  compute_stopped: [],
  compute_failed: [],
  compute_unavailable: [],
  compute_timeout: ['seconds'],
  bill_superseded: ['revision', 'latest'],

  // Short lines on pick lists
  substitute_not_fit: ['sku'],
  substitute_short: ['sku'],
  short_settled: [],
  short_at_most: ['max'],
  line_not_on_list: [],

  // Selling prices, sales tax and accounts' terms
  percent_format: [],
  tax_rate_format: [],
  price_rule_one_of: [],
  pack_rule_needs_case: [],
  exemption_needs_both: [],
  price_level_code_taken: [],
  price_level_in_use: ['accounts'],
  price_rule_taken: [],
  price_level_not_found: [],
  price_rule_not_found: [],
  quote_not_found: [],
  quote_wrong_status: ['quoteStatus'],
  bill_not_found: [],
  customer_email_missing: [],
  quote_mail_failed: ['detail'],

  // Records looked up by id or code
  record_not_found: [],
  job_not_found: [],
  customer_not_found: [],
  takeoff_not_found: [],
  bom_not_found: [],
  lot_not_found: [],
  pick_list_not_found: [],
  transfer_not_found: [],
  reservation_not_found: [],
  user_not_found: [],
  vendor_not_found: [],
  vendor_item_not_found: [],
  policy_not_found: [],
  attachment_not_found: [],
  receipt_not_found: [],
  po_line_not_found: [],
  item_or_warehouse_not_found: [],
  reorder_line_not_found: [],
  item_code_not_found: ['code'],
  bin_code_not_found: ['bin'],
  bin_code_ambiguous: ['bin'],
  lot_code_not_found: ['lot', 'sku'],

  // Stock moves, transfers and reservations
  lot_other_item: ['lot', 'sku'],
  qty_not_positive: [],
  reservation_released: [],
  lines_needed: [],
  transfer_same_warehouse: [],
  transfer_bin_not_shipping: ['bin'],
  bin_in_transit: ['bin'],
  transfer_received: [],
  transfer_line_not_found: ['line'],
  transfer_receive_too_many: ['left', 'line'],
  transfer_bin_not_receiving: ['bin'],
  bin_inactive: ['bin'],
  bin_other_warehouse: ['bin'],
  move_same_bin: [],
  export_too_many_moves: ['total', 'max'],

  // Scans (shared/barcode/scan.ts and the screens that read them)
  scan_empty: [],
  scan_gs1_unreadable: [],
  scan_gs1_field_invalid: ['ai'],
  scan_bin_label_invalid: ['text'],
  scan_lot_label_invalid: ['text'],
  scan_old_qr: [],
  scan_not_gtin: ['text'],
  scan_not_ours: ['text'],
  scan_no_gtin: [],
  scan_sscc_only: ['sscc'],
  scan_not_on_order: ['code'],
  scan_count_invalid: ['count'],
  // GS1 pairing rules a scanned label breaks (warnings: the label is still read)
  scan_pair_gtin_and_contained: [],
  scan_pair_count_with_gtin: [],
  scan_pair_contained_needs_count: [],
  scan_pair_count_needs_contained: [],
  scan_pair_count_needs_sscc: [],
  scan_pair_needs_item: ['ai'],
  scan_pair_serial_needs_gtin: [],

  // Pick lists
  pick_list_status: ['number', 'listStatus', 'pickAction'],
  nothing_to_close_short: [],
  pick_transfer_same_warehouse: [],

  // Purchasing
  company_name_needed: [],
  bill_to_needed: [],
  length_unit_choice: [],
  po_wrong_status: ['poStatus', 'poAction', 'statuses'],
  po_received_cancel: [],
  po_line_not_on_order: [],
  po_no_lines: [],
  special_lines_not_open: [],
  job_nothing_to_order: [],
  job_lines_unmapped: ['lines'],
  vendor_needed: [],
  vendor_inactive: ['vendor'],
  ship_warehouse_needed: [],
  suggestions_missing: ['ids'],
  suggestions_taken: ['ids'],
  vendor_no_price: ['vendor', 'skus'],
  no_vendor_sells: ['skus'],
  lines_need_attention: [],
  item_not_in_catalog: [],
  vendor_price_missing: [],
  lot_needed_for_tint: [],
  over_receipt_reason: ['open'],
  line_listed_twice: [],
  vendor_minimum: ['min'],
  policy_value_needed: [],
  policy_target_missing: [],
  policy_saved_meanwhile: [],

  // Counter, users and catalog
  takeoff_not_in_job: [],
  customer_inactive: [],
  cannot_deactivate_self: [],
  cannot_drop_own_admin: [],
  current_password_wrong: [],

  // Codes answered before each area had its own (kept until every area names its situations)
  stock_taken: [],
  nothing_to_pick: ['warehouse'],
  unreadable: [],
  not_a_bin: [],
  not_an_item: [],
  wrong_bin: [],
  wrong_item: [],
  wrong_lot: [],
  over_pick: ['left', 'qty'],
  duplicate_confirmation: [],
  lines_open: [],
  reservation_missing: [],
  nothing_to_ship: [],
  job_closed: [],
  bill_not_ready: [],
  bill_empty: [],
  has_jobs: [],
  has_bom: [],
  sheet_rows: ['rows'],
  unchanged: [],
  item_reserved: ['reserved', 'sku'],
  insufficient_stock: ['sku', 'bin', 'available', 'wanted'],
  mail_failed: ['detail'],
  over_receipt: ['max'],
  import_invalid: ['rows', 'total'],
  // Bringing a business's own data in (server/services/imports/dataImports.ts and its kinds)
  import_made_to_order: ['sku'],
  import_warehouse_unknown: ['warehouse'],
  import_bin_other_warehouse: ['bin', 'warehouse', 'other'],
  import_bin_unknown: ['bin', 'warehouse'],
  import_bin_not_storage: ['bin'],
  import_lot_required: ['sku'],
  import_qty_whole: ['text'],
  import_qty_negative: ['text'],
  import_qty_pack_word: ['word'],
  import_qty_no_case: ['sku'],
  import_qty_no_pallet: ['sku'],
  import_qty_unreadable: ['text'],
  import_row_repeated: ['row'],
  import_nothing_to_write: [],
  import_not_found: [],
  import_already_reversed: [],
  import_touched: ['sku', 'warehouse'],
  import_kind_unknown: [],
  import_usage_day_or_month: [],
  import_code_exists: ['code'],
  import_records_in_use: ['code'],
  import_vendor_unknown: ['vendor'],
  import_received_over: ['ordered'],
  import_order_differs: ['row'],
  import_order_closed: ['number'],
  import_price_level_unknown: ['level'],
  gs1_prefix_digits: [],
  image_type_not_allowed: [],
  logo_missing: [],
  aborted: [],
} as const satisfies Record<string, readonly string[]>

export type ErrorCode = keyof typeof ERROR_CODES

/** The unit a figure in a message is in; the client converts lengths to the user's unit. */
export type MeasureUnit = 'mm' | 'ml' | 'kg' | 'days' | 'deg'

export type ParamValue = string | number | boolean | null | readonly string[]
export type ErrorParams = Record<string, ParamValue>

type ParamName<C extends ErrorCode> = (typeof ERROR_CODES)[C][number]
/** The values a code's message needs, by name, plus an optional unit. */
export type ParamsOf<C extends ErrorCode> = { [K in ParamName<C>]: ParamValue } & { unit?: MeasureUnit }
/** `problem('at_least', { min: 1 })`: params are required exactly when the code names some. */
export type ParamArgs<C extends ErrorCode> = [ParamName<C>] extends [never] ? [params?: { unit?: MeasureUnit }] : [params: ParamsOf<C>]

/** One problem: a code and the values its message needs. Field errors and whole errors both carry one. */
export interface Problem {
  code: ErrorCode
  params?: ErrorParams
}

/** A problem on one row of an uploaded sheet, with the column it is in (null: the whole row). */
export interface RowProblem {
  column: string | null
  problem: Problem
}

const LENGTH_CODES: Record<LengthParseCode, ErrorCode> = {
  empty: 'length_empty',
  negative: 'length_negative',
  zero_denominator: 'length_zero_denominator',
  decimal_comma: 'length_decimal_comma',
  unreadable: 'length_unreadable',
}

/** A length the user typed that parseLength could not read (shared/units.ts), as a problem to word. */
export function lengthProblem(code: LengthParseCode, input: string): Problem {
  return { code: LENGTH_CODES[code], params: { input } }
}

export function isErrorCode(value: unknown): value is ErrorCode {
  return typeof value === 'string' && Object.hasOwn(ERROR_CODES, value)
}

export function problem<C extends ErrorCode>(code: C, ...[params]: ParamArgs<C>): Problem {
  return params && Object.keys(params).length ? { code, params: params as ErrorParams } : { code }
}
