// Every entity, listed once. A new entity is added here and gets a migration.
import { AuditEntry } from './AuditEntry.js'
import { Bin } from './Bin.js'
import { Bom, BomLine } from './Bom.js'
import { BusinessExportJob } from './BusinessExportJob.js'
import { Customer, Job, Takeoff } from './Customer.js'
import { CountBin, CountItem, CountLine, CycleCount } from './CycleCount.js'
import { DeviceOutboxReport } from './DeviceOutboxReport.js'
import { HandoverTicket, HandoverTicketLine } from './HandoverTicket.js'
import { BomSnapshot, MaterialRoleItem, MaterialRuleRow, WasteAllowance } from './TakeoffSettings.js'
import { IdempotencyRecord } from './IdempotencyRecord.js'
import { Item } from './Item.js'
import { ItemWarehouse } from './ItemWarehouse.js'
import { Lot } from './Lot.js'
import { CustomerTerms, PriceLevel, PriceRuleRow, SalesTaxRate } from './Pricing.js'
import { Quote, QuoteLine } from './Quote.js'
import { Payment, SalesOrder, SalesOrderLine } from './SalesOrder.js'
import { PickConfirmation, PickList, PickListLine, PickShortage, PickTransferProposal } from './PickList.js'
import { PurchaseOrder, PurchaseOrderLine, PurchaseSuggestion } from './PurchaseOrder.js'
import { PurchaseReceipt, PurchaseReceiptLine } from './PurchaseReceipt.js'
import { OutboxAttachment, OutboxMessage } from './OutboxMessage.js'
import { AppSetting } from './AppSetting.js'
import { ReorderPolicyRow } from './ReorderPolicy.js'
import { StockBalance } from './StockBalance.js'
import { StockMove } from './StockMove.js'
import { StockReservation } from './StockReservation.js'
import { Transfer, TransferLine } from './Transfer.js'
import { User } from './User.js'
import { Warehouse } from './Warehouse.js'
import { Vendor, VendorItem } from './Vendor.js'

export const allEntities = [
  PriceLevel,
  PriceRuleRow,
  SalesTaxRate,
  CustomerTerms,
  Quote,
  QuoteLine,
  SalesOrder,
  SalesOrderLine,
  Payment,
  User,
  AuditEntry,
  Item,
  Warehouse,
  Bin,
  Lot,
  Vendor,
  VendorItem,
  StockBalance,
  StockMove,
  StockReservation,
  ItemWarehouse,
  Transfer,
  TransferLine,
  IdempotencyRecord,
  Customer,
  Job,
  Takeoff,
  Bom,
  BomLine,
  PurchaseOrder,
  PurchaseOrderLine,
  PurchaseSuggestion,
  PurchaseReceipt,
  PurchaseReceiptLine,
  OutboxMessage,
  OutboxAttachment,
  AppSetting,
  ReorderPolicyRow,
  MaterialRuleRow,
  WasteAllowance,
  MaterialRoleItem,
  BomSnapshot,
  PickList,
  PickListLine,
  PickConfirmation,
  PickShortage,
  PickTransferProposal,
  CycleCount,
  CountItem,
  CountBin,
  CountLine,
  DeviceOutboxReport,
  HandoverTicket,
  HandoverTicketLine,
  BusinessExportJob,
]
