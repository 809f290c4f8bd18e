/**
 * Feature ranking: the point-biserial correlation of each feature with each class and the random forest's variable
 * importance, as a table (CSV, markdown) and a heat map PNG drawn off screen.
 */
package org.pointcall.models.rank;
