import type { Model, ModelStatic, Sequelize } from 'sequelize';
import { initUser } from './user';
import { initPasswordToken } from './password-token';
import { initBusinessSetting } from './business-setting';
import { initAuditEntry } from './audit-entry';
import { initOutboxMessage } from './outbox-message';
import { initSignInAttempt } from './sign-in-attempt';
import { initAccountRequest } from './account-request';
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

/** `one` has many `many` and each `many` belongs to its `one`, through `foreignKey`; `as` names both ends. */
function oneToMany(
  one: ModelStatic<Model>,
  many: ModelStatic<Model>,
  foreignKey: string,
  as: { many: string; one: string },
) {
  one.hasMany(many, { foreignKey, as: as.many });
  many.belongsTo(one, { foreignKey, as: as.one });
}

/** `one` has many of each model in `many`, under the key's name; each belongs to its `one` as `as`. */
function hasManyEach(
  one: ModelStatic<Model>,
  foreignKey: string,
  as: string,
  many: Record<string, ModelStatic<Model>>,
) {
  for (const [name, model] of Object.entries(many)) oneToMany(one, model, foreignKey, { many: name, one: as });
}

/** Initialises every model once and wires the associations in one place. */
export function initModels(sequelize: Sequelize) {
  const models = {
    User: initUser(sequelize),
    PasswordToken: initPasswordToken(sequelize),
    BusinessSetting: initBusinessSetting(sequelize),
    AuditEntry: initAuditEntry(sequelize),
    OutboxMessage: initOutboxMessage(sequelize),
    SignInAttempt: initSignInAttempt(sequelize),
    AccountRequest: initAccountRequest(sequelize),
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
    User,
    PasswordToken,
    AuditEntry,
    Yard,
    YardKeeper,
    TreatmentKind,
    Colony,
    ColonyEvent,
    Feeding,
    Treatment,
    SuperPull,
    ContainerType,
    Lot,
    LotContainer,
    MoistureReading,
    LabFile,
    LotParent,
    Product,
    StoredFile,
    JarringRun,
    StockLevel,
    StockEntry,
    Order,
    OrderLine,
    OrderAllocation,
    Refund,
  } = models;

  PasswordToken.belongsTo(User, { foreignKey: 'userId', as: 'user' });
  AuditEntry.belongsTo(User, { foreignKey: 'actorUserId', as: 'actor' });

  // Yards, colonies and supers
  Yard.belongsToMany(User, { through: YardKeeper, as: 'keepers', foreignKey: 'yardId', otherKey: 'userId' });
  User.belongsToMany(Yard, { through: YardKeeper, as: 'yards', foreignKey: 'userId', otherKey: 'yardId' });
  oneToMany(Yard, Colony, 'yardId', { many: 'colonies', one: 'yard' });
  Colony.belongsTo(User, { foreignKey: 'keeperId', as: 'keeper' });
  Colony.belongsTo(Colony, { foreignKey: 'parentColonyId', as: 'parent' });
  Colony.hasMany(Colony, { foreignKey: 'parentColonyId', as: 'splits' });
  Colony.belongsTo(Colony, { foreignKey: 'combinedIntoId', as: 'combinedInto' });
  hasManyEach(Colony, 'colonyId', 'colony', {
    events: ColonyEvent,
    feedings: Feeding,
    treatments: Treatment,
    superPulls: SuperPull,
  });
  Treatment.belongsTo(TreatmentKind, { foreignKey: 'treatmentKindId', as: 'kind' });

  // Honey house
  hasManyEach(Lot, 'lotId', 'lot', {
    superPulls: SuperPull,
    containers: LotContainer,
    readings: MoistureReading,
    labFiles: LabFile,
    jarringRuns: JarringRun,
    stockLevels: StockLevel,
  });
  SuperPull.belongsTo(User, { foreignKey: 'voidedByUserId', as: 'voidedBy' });
  LotContainer.belongsTo(ContainerType, { foreignKey: 'containerTypeId', as: 'containerType' });
  oneToMany(Lot, LotParent, 'childLotId', { many: 'parentLinks', one: 'child' });
  oneToMany(Lot, LotParent, 'parentLotId', { many: 'childLinks', one: 'parent' });

  // Jarring and stock
  Product.belongsTo(StoredFile, { foreignKey: 'photoId', as: 'photo' });
  oneToMany(Product, StockLevel, 'productId', { many: 'stockLevels', one: 'product' });
  JarringRun.belongsTo(Product, { foreignKey: 'productId', as: 'product' });
  StockEntry.belongsTo(Product, { foreignKey: 'productId', as: 'product' });
  StockEntry.belongsTo(Lot, { foreignKey: 'lotId', as: 'lot' });
  StockEntry.belongsTo(JarringRun, { foreignKey: 'jarringRunId', as: 'jarringRun' });
  // stock_entries.order_id has no foreign key in the schema.
  StockEntry.belongsTo(Order, { foreignKey: 'orderId', as: 'order', constraints: false });

  // Shop
  Order.belongsTo(User, { foreignKey: 'customerId', as: 'customer' });
  oneToMany(Order, OrderLine, 'orderId', { many: 'lines', one: 'order' });
  oneToMany(Order, Refund, 'orderId', { many: 'refunds', one: 'order' });
  OrderLine.belongsTo(Product, { foreignKey: 'productId', as: 'product' });
  oneToMany(OrderLine, OrderAllocation, 'orderLineId', { many: 'allocations', one: 'line' });
  OrderAllocation.belongsTo(Lot, { foreignKey: 'lotId', as: 'lot' });

  return models;
}

export type Models = ReturnType<typeof initModels>;
