import { CreationOptional, DataTypes, InferAttributes, InferCreationAttributes, Model, Op, Sequelize, type WhereOptions } from 'sequelize';

export type Plan = 'monthly' | 'yearly';
export type SubscriptionStatus = 'pending' | 'active' | 'past_due' | 'canceled';

/** A licensee's paid access to one region, changed only by verified Stripe webhooks. */
export class Subscription extends Model<InferAttributes<Subscription>, InferCreationAttributes<Subscription>> {
  declare id: CreationOptional<number>;
  declare userId: number;
  declare regionId: number;
  declare plan: Plan;
  declare stripeCustomerId: string;
  declare stripeCheckoutId: string;
  declare stripeSubscriptionId: string | null;
  declare status: SubscriptionStatus;
  declare cancelAtPeriodEnd: CreationOptional<boolean>;
  declare currentPeriodEnd: Date | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  /** Whether the subscription gives access now: paid up to a period end still in the future. */
  grantsAccess(now = new Date()): boolean {
    return this.status !== 'pending' && this.currentPeriodEnd !== null && this.currentPeriodEnd > now;
  }

  /** The same rule as grantsAccess, as a query condition. */
  static givingAccess(now = new Date()): WhereOptions<Subscription> {
    return { status: { [Op.ne]: 'pending' }, currentPeriodEnd: { [Op.gt]: now } };
  }

  static initModel(sequelize: Sequelize): void {
    Subscription.init({
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      userId: { type: DataTypes.INTEGER, allowNull: false, field: 'user_id' },
      regionId: { type: DataTypes.INTEGER, allowNull: false, field: 'region_id' },
      plan: { type: DataTypes.ENUM('monthly', 'yearly'), allowNull: false },
      stripeCustomerId: { type: DataTypes.STRING(80), allowNull: false, field: 'stripe_customer_id' },
      stripeCheckoutId: { type: DataTypes.STRING(80), allowNull: false, unique: true, field: 'stripe_checkout_id' },
      stripeSubscriptionId: { type: DataTypes.STRING(80), allowNull: true, unique: true, field: 'stripe_subscription_id' },
      status: { type: DataTypes.ENUM('pending', 'active', 'past_due', 'canceled'), allowNull: false },
      cancelAtPeriodEnd: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false, field: 'cancel_at_period_end' },
      currentPeriodEnd: { type: DataTypes.DATE, allowNull: true, field: 'current_period_end' },
      createdAt: { type: DataTypes.DATE, field: 'created_at' },
      updatedAt: { type: DataTypes.DATE, field: 'updated_at' },
    }, { sequelize, tableName: 'subscriptions', modelName: 'Subscription' });
  }
}

/** Every Stripe event id seen, so a replayed webhook changes nothing. */
export class StripeEvent extends Model<InferAttributes<StripeEvent>, InferCreationAttributes<StripeEvent>> {
  declare id: string;
  declare type: string;
  declare receivedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): void {
    StripeEvent.init({
      id: { type: DataTypes.STRING(80), primaryKey: true },
      type: { type: DataTypes.STRING(80), allowNull: false },
      receivedAt: { type: DataTypes.DATE, field: 'received_at' },
    }, { sequelize, tableName: 'stripe_events', modelName: 'StripeEvent', createdAt: 'receivedAt', updatedAt: false });
  }
}

export class Invoice extends Model<InferAttributes<Invoice>, InferCreationAttributes<Invoice>> {
  declare id: string;
  declare subscriptionId: number;
  declare amount: number;
  declare currency: string;
  declare status: string;
  declare periodStart: Date;
  declare periodEnd: Date;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): void {
    Invoice.init({
      id: { type: DataTypes.STRING(80), primaryKey: true },
      subscriptionId: { type: DataTypes.INTEGER, allowNull: false, field: 'subscription_id' },
      amount: { type: DataTypes.INTEGER, allowNull: false },
      currency: { type: DataTypes.STRING(3), allowNull: false },
      status: { type: DataTypes.STRING(20), allowNull: false },
      periodStart: { type: DataTypes.DATE, allowNull: false, field: 'period_start' },
      periodEnd: { type: DataTypes.DATE, allowNull: false, field: 'period_end' },
      createdAt: { type: DataTypes.DATE, field: 'created_at' },
    }, { sequelize, tableName: 'invoices', modelName: 'Invoice', updatedAt: false });
  }
}
