import { Op } from 'sequelize';

/** A case-insensitive "contains" condition for user text, with LIKE's wildcards taken literally. */
export const containsText = (text: string) => ({ [Op.iLike]: `%${text.replace(/[\\%_]/g, '\\$&')}%` });
