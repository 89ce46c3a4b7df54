import type { Litres, Millilitres } from './quantity';

/** @example litresFromMillilitres(ml(280)) === 0.28 */
export const litresFromMillilitres = (volumeMl: Millilitres): Litres => (volumeMl / 1000) as Litres;
/** @example millilitresFromLitres(0.28 as Litres) === 280 */
export const millilitresFromLitres = (volumeL: Litres): Millilitres => (volumeL * 1000) as Millilitres;
