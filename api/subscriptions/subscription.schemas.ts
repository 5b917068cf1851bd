import { z } from 'zod';

export const checkoutSchema = z.object({
  regionId: z.number().int().positive(),
  plan: z.enum(['monthly', 'yearly']),
}).strict();

/** Prices in the smallest currency unit (common practice for payment APIs). */
export const PLAN_PRICES = { monthly: 4900, yearly: 49000 } as const;
export const CURRENCY = 'eur';

export interface PlanView { regionId: number; regionName: string; plan: 'monthly' | 'yearly'; amount: number; currency: string }
export interface InvoiceView { id: string; amount: number; currency: string; status: string; periodStart: string; periodEnd: string }
export interface SubscriptionView {
  id: number; regionId: number; regionName: string; plan: 'monthly' | 'yearly';
  status: 'pending' | 'active' | 'past_due' | 'canceled'; cancelAtPeriodEnd: boolean; currentPeriodEnd: string | null;
  hasAccess: boolean; invoices: InvoiceView[];
}
