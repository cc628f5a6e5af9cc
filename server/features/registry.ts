import type { Router } from 'express';
import type { AppContext } from '../app';

/**
 * Each feature contributes one router factory. Add a line here when a feature gets routes;
 * the authorization-matrix test reads the resulting route table.
 */
export type FeatureRoutes = (ctx: AppContext) => Router;

export const featureRoutes: FeatureRoutes[] = [];
