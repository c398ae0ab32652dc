/** A household's canners, prices, empty-jar stock and dry goods on hand. */
import { date, doublePrecision, index, integer, pgTable, primaryKey, text, uuid } from 'drizzle-orm/pg-core'
import { gaugeTypes, jarMouths, priceKinds } from '../../../utils/vocabulary'
import { timestamps } from './columns'
import { households } from './people'
import { jarSizes, ingredients } from './reference'

export const canners = pgTable('canners', {
  id: uuid('id').primaryKey().defaultRandom(),
  householdId: uuid('household_id').notNull().references(() => households.id, { onDelete: 'cascade' }),
  name: text('name').notNull(),
  innerDiameterMm: doublePrecision('inner_diameter_mm').notNull(),
  usableHeightMm: doublePrecision('usable_height_mm').notNull(),
  rackThicknessMm: doublePrecision('rack_thickness_mm').notNull().default(6),
  gaugeType: text('gauge_type', { enum: gaugeTypes }).notNull(),
  maxLayers: integer('max_layers').notNull().default(1),
  waterDepthMm: doublePrecision('water_depth_mm').notNull().default(76),
  lastGaugeTestAt: date('last_gauge_test_at'),
  ...timestamps,
}, t => [index('canners_household_idx').on(t.householdId)])

export const priceItems = pgTable('price_items', {
  id: uuid('id').primaryKey().defaultRandom(),
  householdId: uuid('household_id').notNull().references(() => households.id, { onDelete: 'cascade' }),
  kind: text('kind', { enum: priceKinds }).notNull(),
  label: text('label').notNull(),
  ingredientId: text('ingredient_id').references(() => ingredients.id),
  jarSizeId: text('jar_size_id').references(() => jarSizes.id),
  mouth: text('mouth', { enum: jarMouths }),
  /** Package contents: grams (dry goods, salt), millilitres (vinegar) or a count (lids, jars). */
  packageGrams: doublePrecision('package_grams'),
  packageMl: doublePrecision('package_ml'),
  packCount: integer('pack_count'),
  priceCents: integer('price_cents').notNull(),
  ...timestamps,
}, t => [index('price_items_household_idx').on(t.householdId)])

export const jarStock = pgTable('jar_stock', {
  householdId: uuid('household_id').notNull().references(() => households.id, { onDelete: 'cascade' }),
  jarSizeId: text('jar_size_id').notNull().references(() => jarSizes.id),
  count: integer('count').notNull().default(0),
  ...timestamps,
}, t => [primaryKey({ columns: [t.householdId, t.jarSizeId] })])

/** Dry goods the household has in the pantry, by ingredient: the Market list buys only the rest. */
export const dryGoodsStock = pgTable('dry_goods_stock', {
  householdId: uuid('household_id').notNull().references(() => households.id, { onDelete: 'cascade' }),
  ingredientId: text('ingredient_id').notNull().references(() => ingredients.id),
  grams: doublePrecision('grams').notNull().default(0),
  ...timestamps,
}, t => [primaryKey({ columns: [t.householdId, t.ingredientId] })])
