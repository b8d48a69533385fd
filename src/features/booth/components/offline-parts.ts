/**
 * What the booth card needs only when this tablet holds entries for the job (loaded then, so a card with nothing
 * waiting downloads none of it): the card moved on over waiting coats, and the list of waiting and refused entries.
 */
export { withWaitingCoats } from "../api/booth-overlay";
export { QueuedEntries } from "./queued-entries";
