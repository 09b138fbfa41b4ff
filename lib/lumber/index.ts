export {
  boardFeet,
  dressedDimension,
  dressedSize,
  LumberParseError,
  NOMINAL_SIZES,
  parseNominalProfile,
  parseQuarters,
  plywoodActualThickness,
  softwoodBoardFeet,
  type DressedSize,
  type NominalProfile,
} from './lumber';
