import type { Source } from './source';

/** Standards and definitions used across the core. */
export const standardSources = [
  {
    id: 'ciaaw-2021',
    authors: 'IUPAC Commission on Isotopic Abundances and Atomic Weights (CIAAW)',
    title: 'Standard atomic weights of the elements 2021',
    publication: 'Pure Appl Chem 2022;94:573-600 (Prohaska et al.); abridged and conventional values, ciaaw.org',
    year: 2022,
    locator: 'Table 2 (abridged standard atomic weights, five significant figures) and conventional values',
    status: 'standard',
    note: 'Values typed from memory of the CIAAW abridged table; tests compare them with the molar masses computed by the mf-parser package.',
  },
  {
    id: 'ucum',
    authors: 'Regenstrief Institute',
    title: 'The Unified Code for Units of Measure (UCUM)',
    publication: 'unitsofmeasure.org, version 2.1',
    year: 2017,
    status: 'standard',
  },
  {
    id: 'definition',
    authors: '—',
    title: 'By definition',
    publication: '—',
    year: null,
    status: 'definition',
  },
  {
    id: 'common-practice',
    authors: '—',
    title: 'Common practice of the trade (no single published source)',
    publication: '—',
    year: null,
    status: 'common-practice',
  },
] as const satisfies readonly Source[];
