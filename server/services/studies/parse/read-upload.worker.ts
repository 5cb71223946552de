/** Entry of the upload-reading threads (upload-reader.ts starts them): one task, one outcome; decay sets run readDecays and spectrum matrices readSpectrumMatrix, absorption titrations readAbsorptionTitration by name. */
export { readAndMap as default } from './read-and-map';
export { readDecays } from '../../decays/read-decays';
export { readSpectrumMatrix } from '../../mechanism/read-spectrum-matrix';
export { readAbsorptionTitration } from '../../mechanism/read-absorption-titration';
