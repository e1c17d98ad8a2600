/**
 * How talus turns a CRS spec ('EPSG:n' or a proj4 string) into a CrsInfo. The DEM reader takes
 * the resolver as a parameter so the definitions live in one place (the station CRS registry)
 * and tests can supply definitions made by PROJ's projinfo.
 */
import type { CrsInfo } from './grid.js';

/** Resolves 'EPSG:n' or a proj4 string; throws InputError for an unknown code or a bad string. */
export type CrsResolver = (spec: string) => CrsInfo;
