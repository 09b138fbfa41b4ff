export {
  checkDeliverable,
  checkDisclosure,
  checkLength,
  checkMustSay,
  checkPlacement,
  disclosureStartSeconds,
  DISCLOSURE_CAUTION,
  DISCLOSURE_WINDOW_SECONDS,
  type CheckName,
  type CheckResult,
  type CheckStatus,
  type DeliverableCheckInput,
  type PlacementRule,
  type ReadRange,
} from './checks';
export { findPhrase, tokenize } from './words';
