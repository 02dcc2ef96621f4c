/** What one jar label says: the data lib/data hands to the label sheet (labels.ts) and its planner (label-plan.ts). */
export type LabelContent = {
  productName: string;
  floralSource: string;
  netQuantity: string;
  businessName: string;
  businessAddress: string;
  lotCode: string;
  bestBefore: string; // YYYY-MM-DD, carried in AI (15)
  bestBeforeText: string; // as printed, e.g. "31 Dec 2027"
  gtin: string;
  publicUrl: string;
  copies?: number;
};
