// Each feature's demo seed registers itself with registerSeedStep() when imported here.
export {};
import '../ingredients/ingredients.seed';
import '../briefs/briefs.seed';
import '../hazards/hazards.seed';
