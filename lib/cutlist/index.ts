export {
  firstFitDecreasing,
  martelloTothL2,
  planLinearCuts,
  type LinearBoard,
  type LinearCut,
  type LinearCutPlan,
  type LinearCutRequest,
  type LinearPart,
  type LinearPurchase,
  type LinearStock,
  type LinearUnplaced,
} from './linear';
