/** Entry of the upload-reading threads (upload-reader.ts starts them): one task, one outcome. */
export { readAndMap as default } from './read-and-map';
