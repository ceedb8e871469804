// Safety cautions for knitted pieces: by garment, the wearer's age band and the yarn's fibre.
export {
  ACCESSORY_SCOPE,
  AGE_BANDS,
  WEARER_BANDS,
  getAgeBand,
  getCautions,
  type AgeBand,
  type Caution,
  type CautionGarment,
  type CautionId,
  type Wearer,
} from "./cautions";
export { ANIMAL_FIBRE, PLANT_FIBRE, SHEDDING_FIBRE, SYNTHETIC_FIBRE, hasAnimalFibre, mayShed } from "./fibres";
