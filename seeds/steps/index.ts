// The demo scenario's steps, in the order they run. Add a step here.
import type { SeedStep } from '../context';
import { accountsStep } from './accounts';
import { fleetStep } from './fleet';
import { workOrdersStep } from './work-orders';

export const SEED_STEPS: SeedStep[] = [fleetStep, accountsStep, workOrdersStep];
