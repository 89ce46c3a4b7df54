import { z } from 'zod';
import { fail, issue, ok, type Result } from '../result';

/**
 * The products a practical dose is built from: tablets (with the strengths on
 * the shelf and whether each may be halved), an oral solution (its
 * concentration) and vials (their sizes). Data with sources; the local
 * formulary replaces it with its own list, validated by
 * {@link parseProductCatalogue}.
 */

/** Drugs a product may contain (generic names only). */
export const productDrugs = ['deferasirox', 'deferiprone', 'deferoxamine'] as const;

const productIdSchema = z
  .string()
  .regex(/^[a-z0-9]+(-[a-z0-9]+)*$/, 'a product id is kebab-case: lower-case letters, digits and hyphens (deferasirox-film-coated)');

/** Tablet and vial strengths are whole or half milligrams; 1 mg to 10 g is every plausible strength. */
const strengthMgSchema = z
  .number()
  .min(1)
  .max(10000)
  .refine((value) => Number.isInteger(value * 2), 'a strength is a whole number of mg (or a half, e.g. 62.5)');

const sourceIdsSchema = z.array(z.string().min(1)).min(1);

const tabletStrengthSchema = z.strictObject({
  strengthMg: strengthMgSchema,
  /** True only where the label says the tablet may be broken into equal halves. */
  halvable: z.boolean(),
  note: z.string().max(400).optional(),
});

const shared = {
  id: productIdSchema,
  drug: z.enum(productDrugs),
  name: z.string().min(1).max(120),
  sourceIds: sourceIdsSchema,
  /** The administrations per day the product is made for, where the label ties them (the two deferiprone 1,000 mg tablets). */
  administrationsPerDay: z.number().int().min(1).max(6).optional(),
  note: z.string().max(600).optional(),
};

export const productSchema = z.discriminatedUnion('kind', [
  z.strictObject({
    ...shared,
    kind: z.literal('tablets'),
    /** What one piece is called: a tablet (default) or a single-dose sachet of oral granules, which is never divided. */
    unit: z.enum(['tablet', 'sachet']).optional(),
    strengths: z.array(tabletStrengthSchema).min(1).max(8),
  }),
  z.strictObject({ ...shared, kind: z.literal('oral-solution'), concentrationMgPerMl: z.number().min(1).max(1000) }),
  z.strictObject({ ...shared, kind: z.literal('vials'), vialStrengthsMg: z.array(strengthMgSchema).min(1).max(8) }),
]);

export const productCatalogueSchema = z
  .array(productSchema)
  .min(1)
  .max(100)
  .superRefine((products, context) => {
    const seen = new Set<string>();
    products.forEach((product, index) => {
      if (seen.has(product.id)) {
        context.addIssue({ code: 'custom', path: [index, 'id'], message: `product id "${product.id}" appears twice` });
      }
      seen.add(product.id);
      const strengths = product.kind === 'tablets' ? product.strengths.map((it) => it.strengthMg) : product.kind === 'vials' ? product.vialStrengthsMg : [];
      if (new Set(strengths).size !== strengths.length) {
        context.addIssue({ code: 'custom', path: [index], message: `product "${product.id}" lists a strength twice` });
      }
    });
  });

export type Product = z.output<typeof productSchema>;
export type TabletProduct = Extract<Product, { kind: 'tablets' }>;
export type SolutionProduct = Extract<Product, { kind: 'oral-solution' }>;
export type VialProduct = Extract<Product, { kind: 'vials' }>;
export type ProductCatalogue = readonly Product[];

/**
 * The catalogue shipped with the tool. Every strength is from memory of the
 * labels (see core/references/dosing.ts): check it against the local
 * formulary, and supply an edited catalogue where it differs.
 */
export const defaultProductCatalogue: ProductCatalogue = [
  {
    id: 'deferasirox-film-coated',
    drug: 'deferasirox',
    kind: 'tablets',
    name: 'deferasirox film-coated tablets',
    // 90, 180 and 360 mg: deferasirox labels, from memory (dosing-deferasirox-strengths-memory). Halves not described: whole only.
    strengths: [
      { strengthMg: 90, halvable: false },
      { strengthMg: 180, halvable: false },
      { strengthMg: 360, halvable: false },
    ],
    sourceIds: ['dosing-deferasirox-strengths-memory'],
    note: 'Strengths from memory of the labels; whole tablets only.',
  },
  {
    id: 'deferasirox-dispersible',
    drug: 'deferasirox',
    kind: 'tablets',
    name: 'deferasirox dispersible tablets',
    // 125, 250 and 500 mg: deferasirox labels, from memory. Dispersed whole in liquid: whole only.
    strengths: [
      { strengthMg: 125, halvable: false },
      { strengthMg: 250, halvable: false },
      { strengthMg: 500, halvable: false },
    ],
    sourceIds: ['dosing-deferasirox-strengths-memory'],
    note: 'Strengths from memory of the labels; dispersed whole, so whole tablets only.',
  },
  {
    id: 'deferasirox-granules',
    drug: 'deferasirox',
    kind: 'tablets',
    unit: 'sachet',
    name: 'deferasirox oral granules, single-dose sachets',
    // 90, 180 and 360 mg sachets: references.md §9 (national drug code records, confirmed; 180 and 360 mg granule
    // packets seen again in openFDA's NDC directory). The label's §3 and its revision date were not seen, so the
    // strengths rest on the NDC records, not on the label text. A sachet is taken whole: no halves.
    strengths: [
      { strengthMg: 90, halvable: false },
      { strengthMg: 180, halvable: false },
      { strengthMg: 360, halvable: false },
    ],
    sourceIds: ['dosing-deferasirox-granules-ndc'],
    note: 'Strengths from the US national drug code records (the label’s §3 and revision date not seen); whole sachets only.',
  },
  {
    id: 'deferiprone-tablets',
    drug: 'deferiprone',
    kind: 'tablets',
    name: 'deferiprone film-coated tablets',
    strengths: [
      // 500 mg: EU SmPC (2004 annex I) §3 "The tablets are scored and breakable in half"; §4.2 "Dosage per
      // kilogram body weight should be calculated to the nearest half tablet" (deferiprone-label, confirmed).
      { strengthMg: 500, halvable: true, note: 'Scored and breakable in half (EU SmPC §3); doses to the nearest half tablet (§4.2).' },
      // 1000 mg: EU SmPC (2023 annex I, French text) §3 "Le comprimé peut être divisé en deux demi doses égales"
      // (deferiprone-smpc-eu-2023, confirmed), as for the 500 mg tablet.
      { strengthMg: 1000, halvable: true, note: 'Scored; may be divided into two equal halves (EU SmPC 2023 §3).' },
    ],
    sourceIds: ['deferiprone-label', 'deferiprone-smpc-eu-2023'],
    note: 'EU film-coated tablets: both strengths scored and breakable into equal halves (SmPC §3); the dose is calculated to the nearest half tablet (SmPC §4.2). Check the local product.',
  },
  {
    id: 'deferiprone-tablets-1000-twice-daily',
    drug: 'deferiprone',
    kind: 'tablets',
    name: 'deferiprone 1,000 mg tablets for twice-a-day dosing',
    // US label (March 2025) §2.1: a 1,000 mg tablet for twice-a-day dosing, not interchangeable with the
    // three-times-a-day tablet (references.md §9, confirmed). Breaking it is not described: whole only (from memory).
    strengths: [{ strengthMg: 1000, halvable: false }],
    administrationsPerDay: 2,
    sourceIds: ['deferiprone-label-us-2025', 'dosing-deferiprone-strengths-memory'],
    note: 'Twice-a-day tablet; the label asks that the tablet matches the regimen.',
  },
  {
    id: 'deferiprone-tablets-1000-three-times-daily',
    drug: 'deferiprone',
    kind: 'tablets',
    name: 'deferiprone 1,000 mg tablets for three-times-a-day dosing',
    // US label (March 2025) §2.1; scored, doses rounded to the nearest half tablet (references.md §9).
    strengths: [{ strengthMg: 1000, halvable: true }],
    administrationsPerDay: 3,
    sourceIds: ['deferiprone-label-us-2025', 'dosing-deferiprone-strengths-memory'],
    note: 'Three-times-a-day tablet; the label asks that the tablet matches the regimen.',
  },
  {
    id: 'deferiprone-oral-solution',
    drug: 'deferiprone',
    kind: 'oral-solution',
    name: 'deferiprone oral solution',
    // 100 mg/mL: deferiprone labels, from memory.
    concentrationMgPerMl: 100,
    sourceIds: ['dosing-deferiprone-strengths-memory', 'dosing-measurable-volume'],
    note: 'Concentration from memory of the labels.',
  },
  {
    id: 'deferoxamine-vials',
    drug: 'deferoxamine',
    kind: 'vials',
    name: 'deferoxamine mesylate powder for injection, single-use vials',
    // 500 mg and 2 g of the mesylate: deferoxamine labels, from memory.
    vialStrengthsMg: [500, 2000],
    sourceIds: ['dosing-deferoxamine-vials-memory'],
    note: 'Vial sizes from memory of the labels; strengths are of the mesylate, as dosed.',
  },
];

/**
 * Check a product catalogue supplied by the user (the local formulary).
 *
 * @param json - parsed JSON: an array of products (kind 'tablets',
 *   'oral-solution' or 'vials'); strengths 1–10,000 mg in whole or half mg,
 *   concentrations 1–1,000 mg/mL; ids kebab-case and unique
 * @returns the catalogue, or one issue per problem naming the field and the value
 * @example parseProductCatalogue([{ id: 'deferasirox-film-coated', drug: 'deferasirox', kind: 'tablets',
 *   name: 'local', strengths: [{ strengthMg: 90, halvable: false }], sourceIds: ['local-formulary'] }]).ok === true
 */
export function parseProductCatalogue(json: unknown): Result<ProductCatalogue> {
  const parsed = productCatalogueSchema.safeParse(json);
  if (parsed.success) return ok(parsed.data);
  return fail(
    ...parsed.error.issues.map((problem) => {
      const where = problem.path.length > 0 ? problem.path.map(String).join('.') : 'catalogue';
      const value = valueAt(json, problem.path);
      const shown = value === undefined ? '' : ` (value ${JSON.stringify(value)})`;
      const code = problem.code === 'too_small' || problem.code === 'too_big' ? 'out_of_range' : 'invalid_file';
      return issue(code, ['catalogue', ...problem.path.map((it) => (typeof it === 'symbol' ? String(it) : it))], `Product catalogue ${where}${shown}: ${problem.message}.`);
    }),
  );
}

function valueAt(root: unknown, path: readonly PropertyKey[]): unknown {
  let current: unknown = root;
  for (const key of path) {
    if (current === null || typeof current !== 'object') return undefined;
    current = (current as Record<PropertyKey, unknown>)[key];
  }
  return typeof current === 'object' ? undefined : current;
}

/**
 * One product by id.
 *
 * @param catalogue - the shipped or the local catalogue
 * @param productId - kebab-case id, e.g. 'deferasirox-film-coated'
 * @returns the product, or an unknown_choice issue listing the ids there are
 * @example findProduct(defaultProductCatalogue, 'deferoxamine-vials').ok === true
 */
export function findProduct(catalogue: ProductCatalogue, productId: string): Result<Product> {
  const product = catalogue.find((it) => it.id === productId);
  if (product) return ok(product);
  return fail(
    issue('unknown_choice', ['product'], `Product "${productId}" is not in the catalogue; the products are ${catalogue.map((it) => it.id).join(', ')}.`),
  );
}
