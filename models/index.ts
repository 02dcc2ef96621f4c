import type { Sequelize } from 'sequelize';
import { initUser } from './user';
import { initPasswordToken } from './password-token';
import { initBusinessSetting } from './business-setting';
import { initAuditEntry } from './audit-entry';
import { initOutboxMessage } from './outbox-message';
import { initSignInAttempt } from './sign-in-attempt';
import { initYard } from './yard';
import { initYardKeeper } from './yard-keeper';
import { initTreatmentKind } from './treatment-kind';
import { initColony } from './colony';
import { initColonyEvent } from './colony-event';
import { initFeeding } from './feeding';
import { initTreatment } from './treatment';
import { initSuperTag } from './super-tag';
import { initSuperPull } from './super-pull';
import { initContainerType } from './container-type';
import { initLotSequence } from './lot-sequence';
import { initLot } from './lot';
import { initLotContainer } from './lot-container';
import { initMoistureReading } from './moisture-reading';
import { initLabFile } from './lab-file';
import { initLotParent } from './lot-parent';
import { initProduct } from './product';
import { initStoredFile } from './stored-file';
import { initLabelLayoutRecord } from './label-layout';
import { initJarringRun } from './jarring-run';
import { initStockLevel } from './stock-level';
import { initStockEntry } from './stock-entry';
import { initOrder } from './order';
import { initOrderLine } from './order-line';
import { initOrderAllocation } from './order-allocation';
import { initStripeEvent } from './stripe-event';
import { initRefund } from './refund';

/** Initialises every model once and wires the associations in one place. */
export function initModels(sequelize: Sequelize) {
  const models = {
    User: initUser(sequelize),
    PasswordToken: initPasswordToken(sequelize),
    BusinessSetting: initBusinessSetting(sequelize),
    AuditEntry: initAuditEntry(sequelize),
    OutboxMessage: initOutboxMessage(sequelize),
    SignInAttempt: initSignInAttempt(sequelize),
    // Yards, colonies and supers
    Yard: initYard(sequelize),
    YardKeeper: initYardKeeper(sequelize),
    TreatmentKind: initTreatmentKind(sequelize),
    Colony: initColony(sequelize),
    ColonyEvent: initColonyEvent(sequelize),
    Feeding: initFeeding(sequelize),
    Treatment: initTreatment(sequelize),
    SuperTag: initSuperTag(sequelize),
    SuperPull: initSuperPull(sequelize),
    // Honey house
    ContainerType: initContainerType(sequelize),
    LotSequence: initLotSequence(sequelize),
    Lot: initLot(sequelize),
    LotContainer: initLotContainer(sequelize),
    MoistureReading: initMoistureReading(sequelize),
    LabFile: initLabFile(sequelize),
    LotParent: initLotParent(sequelize),
    // Jarring and stock
    Product: initProduct(sequelize),
    StoredFile: initStoredFile(sequelize),
    LabelLayoutRecord: initLabelLayoutRecord(sequelize),
    JarringRun: initJarringRun(sequelize),
    StockLevel: initStockLevel(sequelize),
    StockEntry: initStockEntry(sequelize),
    // Shop
    Order: initOrder(sequelize),
    OrderLine: initOrderLine(sequelize),
    OrderAllocation: initOrderAllocation(sequelize),
    StripeEvent: initStripeEvent(sequelize),
    Refund: initRefund(sequelize),
  };
  const {
    User, PasswordToken, AuditEntry,
    Yard, YardKeeper, TreatmentKind, Colony, ColonyEvent, Feeding, Treatment, SuperPull,
    ContainerType, Lot, LotContainer, MoistureReading, LabFile, LotParent,
    Product, StoredFile, JarringRun, StockLevel, StockEntry,
    Order, OrderLine, OrderAllocation, Refund,
  } = models;

  PasswordToken.belongsTo(User, { foreignKey: 'userId', as: 'user' });
  AuditEntry.belongsTo(User, { foreignKey: 'actorUserId', as: 'actor' });

  // Yards, colonies and supers
  Yard.belongsToMany(User, { through: YardKeeper, as: 'keepers', foreignKey: 'yardId', otherKey: 'userId' });
  User.belongsToMany(Yard, { through: YardKeeper, as: 'yards', foreignKey: 'userId', otherKey: 'yardId' });
  Yard.hasMany(Colony, { foreignKey: 'yardId', as: 'colonies' });

  Colony.belongsTo(Yard, { foreignKey: 'yardId', as: 'yard' });
  Colony.belongsTo(User, { foreignKey: 'keeperId', as: 'keeper' });
  Colony.belongsTo(Colony, { foreignKey: 'parentColonyId', as: 'parent' });
  Colony.hasMany(Colony, { foreignKey: 'parentColonyId', as: 'splits' });
  Colony.belongsTo(Colony, { foreignKey: 'combinedIntoId', as: 'combinedInto' });
  Colony.hasMany(ColonyEvent, { foreignKey: 'colonyId', as: 'events' });
  Colony.hasMany(Feeding, { foreignKey: 'colonyId', as: 'feedings' });
  Colony.hasMany(Treatment, { foreignKey: 'colonyId', as: 'treatments' });
  Colony.hasMany(SuperPull, { foreignKey: 'colonyId', as: 'superPulls' });
  ColonyEvent.belongsTo(Colony, { foreignKey: 'colonyId', as: 'colony' });
  Feeding.belongsTo(Colony, { foreignKey: 'colonyId', as: 'colony' });
  Treatment.belongsTo(Colony, { foreignKey: 'colonyId', as: 'colony' });
  Treatment.belongsTo(TreatmentKind, { foreignKey: 'treatmentKindId', as: 'kind' });
  SuperPull.belongsTo(Colony, { foreignKey: 'colonyId', as: 'colony' });
  SuperPull.belongsTo(Lot, { foreignKey: 'lotId', as: 'lot' });
  SuperPull.belongsTo(User, { foreignKey: 'voidedByUserId', as: 'voidedBy' });

  // Honey house
  Lot.hasMany(SuperPull, { foreignKey: 'lotId', as: 'superPulls' });
  Lot.hasMany(LotContainer, { foreignKey: 'lotId', as: 'containers' });
  Lot.hasMany(MoistureReading, { foreignKey: 'lotId', as: 'readings' });
  Lot.hasMany(LabFile, { foreignKey: 'lotId', as: 'labFiles' });
  Lot.hasMany(JarringRun, { foreignKey: 'lotId', as: 'jarringRuns' });
  Lot.hasMany(StockLevel, { foreignKey: 'lotId', as: 'stockLevels' });
  Lot.hasMany(LotParent, { foreignKey: 'childLotId', as: 'parentLinks' });
  Lot.hasMany(LotParent, { foreignKey: 'parentLotId', as: 'childLinks' });
  LotParent.belongsTo(Lot, { foreignKey: 'parentLotId', as: 'parent' });
  LotParent.belongsTo(Lot, { foreignKey: 'childLotId', as: 'child' });
  LotContainer.belongsTo(Lot, { foreignKey: 'lotId', as: 'lot' });
  LotContainer.belongsTo(ContainerType, { foreignKey: 'containerTypeId', as: 'containerType' });
  MoistureReading.belongsTo(Lot, { foreignKey: 'lotId', as: 'lot' });
  LabFile.belongsTo(Lot, { foreignKey: 'lotId', as: 'lot' });

  // Jarring and stock
  Product.belongsTo(StoredFile, { foreignKey: 'photoId', as: 'photo' });
  Product.hasMany(StockLevel, { foreignKey: 'productId', as: 'stockLevels' });
  JarringRun.belongsTo(Lot, { foreignKey: 'lotId', as: 'lot' });
  JarringRun.belongsTo(Product, { foreignKey: 'productId', as: 'product' });
  StockLevel.belongsTo(Product, { foreignKey: 'productId', as: 'product' });
  StockLevel.belongsTo(Lot, { foreignKey: 'lotId', as: 'lot' });
  StockEntry.belongsTo(Product, { foreignKey: 'productId', as: 'product' });
  StockEntry.belongsTo(Lot, { foreignKey: 'lotId', as: 'lot' });
  StockEntry.belongsTo(JarringRun, { foreignKey: 'jarringRunId', as: 'jarringRun' });
  // stock_entries.order_id has no foreign key in the schema.
  StockEntry.belongsTo(Order, { foreignKey: 'orderId', as: 'order', constraints: false });

  // Shop
  Order.belongsTo(User, { foreignKey: 'customerId', as: 'customer' });
  Order.hasMany(OrderLine, { foreignKey: 'orderId', as: 'lines' });
  Order.hasMany(Refund, { foreignKey: 'orderId', as: 'refunds' });
  OrderLine.belongsTo(Order, { foreignKey: 'orderId', as: 'order' });
  OrderLine.belongsTo(Product, { foreignKey: 'productId', as: 'product' });
  OrderLine.hasMany(OrderAllocation, { foreignKey: 'orderLineId', as: 'allocations' });
  OrderAllocation.belongsTo(OrderLine, { foreignKey: 'orderLineId', as: 'line' });
  OrderAllocation.belongsTo(Lot, { foreignKey: 'lotId', as: 'lot' });
  Refund.belongsTo(Order, { foreignKey: 'orderId', as: 'order' });

  return models;
}

export type Models = ReturnType<typeof initModels>;
