import { effectiveRules, type RulesOverride } from '#shared/domain/rounds/rules';
import type { Db } from '../../db/client';
import { rulesOf, type RoundInput } from './round-input';
import { updateCollectionRules } from './rounds.repository';

/** A collection's round rules: the defaults, its own overrides, and the two combined. */
export function createRulesService(db: Db, input: Pick<RoundInput, 'collectionOf'>) {
  const service = {
    async rules(collectionId: string) {
      const c = await input.collectionOf(collectionId);
      return {
        rules: rulesOf(c),
        defaults: effectiveRules({}),
        overrides: (c.rules ?? {}) as RulesOverride,
      };
    },

    /** Replaces the collection's overrides; today's built round stays as it was built. */
    async replaceRules(collectionId: string, overrides: RulesOverride) {
      await updateCollectionRules(db, collectionId, overrides);
      return service.rules(collectionId);
    },
  };
  return service;
}
