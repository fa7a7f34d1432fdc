/**
 * Version of the computation engine. The API stores it with every revision so a stored budget can
 * be traced to the code that computed it. Bump the minor part when a result changes numerically,
 * the patch part for fixes that leave every stored result unchanged.
 */
export const LINK_CORE_VERSION = '0.2.0';
