// The demo scenario's steps, in the order they run. Add a step here.
import type { SeedStep } from '../context';
import { accountsStep } from './accounts';
import { historyStep } from './history';
import { monitorStep } from './monitor';
import { scenarioStep } from './scenario';
import { serviceHistoryStep } from './service-history';
import { workOrdersStep } from './work-orders';

export const SEED_STEPS: SeedStep[] = [scenarioStep, accountsStep, workOrdersStep, historyStep, monitorStep, serviceHistoryStep];
