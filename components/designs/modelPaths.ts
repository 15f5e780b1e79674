// The stored model as the Drawing component wants it: one piece of code, shared with the server.
export { modelToLayerPaths as modelLayerPaths } from '../../shared/geometry/paths';
