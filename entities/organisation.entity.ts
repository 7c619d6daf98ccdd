import { defineEntity, type InferEntity } from '@mikro-orm/core';
import { p, uuidPk, createdAt, double } from './common';

export const OrganisationSchema = defineEntity({
  name: 'Organisation',
  tableName: 'organisation',
  properties: {
    id: uuidPk(),
    // The slug is the organisation's part of every URL (/o/[slug]/...).
    slug: p.string().length(64).unique(),
    name: p.string().length(120),
    // Months before a group's renew-by date by which its renewal docking must fall.
    renewalMarginMonths: p.integer().default(6),
    // Renew when less than this percentage of a group's original anode mass remains (or at the
    // utilisation factor when that comes first): the renew-by date of every forecast.
    renewalThresholdPercent: p.integer().default(25),
    // Cost basis for option comparison, per kg of net anode mass fitted.
    fittingRatePerKg: double().nullable(),
    currency: p.string().length(3).default('EUR'),
    // Subscription, mirrored from the payment service by signed webhooks (never from the browser).
    plan: p.string().length(16).nullable().$type<'harbour' | 'fleet' | 'armada'>(),
    subscriptionStatus: p.string().length(24).default('trialing'),
    trialEndsAt: p.datetime().nullable(),
    stripeCustomerId: p.string().length(64).nullable().unique(),
    // One subscription belongs to one organisation (and an organisation holds one at a time).
    stripeSubscriptionId: p.string().length(64).nullable().unique(),
    currentPeriodEnd: p.datetime().nullable(),
    cancelAtPeriodEnd: p.boolean().default(false),
    pastDueSince: p.datetime().nullable(),
    lastDigestAt: p.datetime().nullable(),
    createdAt: createdAt(),
  },
});
export type Organisation = InferEntity<typeof OrganisationSchema>;
