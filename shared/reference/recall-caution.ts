/**
 * The caution every recall report carries: the records find the lots; what is done with them is
 * the kitchen's recall plan's and the authorities' to say. The report does not decide a recall's
 * class or reach, which the regulator sets. source: 21 CFR Part 7, Subpart C, "Recalls
 * (Including Product Corrections)"; for meat and poultry, FSIS Directive 8080.1, "Recall of Meat
 * and Poultry Products" (from memory: the wording below is common practice, no source)
 */
export const RECALL_CAUTION =
  "This report lists what the kitchen's records say about where the lot went. Act on a recall by the kitchen's own recall plan and the instructions of the supplier and the food safety authority: hold what is on hand apart and labelled, and do not serve or sell it until they say.";

/**
 * What a recall report says when some of the lot went to a site of the group the person asking
 * has no role at: those lots stay unnamed to them, so the recall must be followed there by
 * someone who may see that site. common practice, no source
 */
export const RECALL_ELSEWHERE =
  'Some of it went to another site of the group, which this report does not name: ask an admin of the group, or a person with a role at every site, to produce the recall report there too.';
