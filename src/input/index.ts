export type { Delivery, DeliverySummary, Encoding, InputOptions, RawRecord, StructureBreak } from "./types.js";
export { openDelivery } from "./open.js";
