/** The words an assembly batch's result is read by: its parts' group and its figures. */

/** The title of the group that lists an assembly batch's parts. */
export const PARTS_GROUP = 'Parts';

/** The input that gives how many units (burgers, packs) an assembly batch made. */
export const UNITS_INPUT = 'Units';

/** The figure of an assembly batch that gives the weight of one unit (a burger, a pack). */
export const UNIT_WEIGHT = 'Weight of one unit';
