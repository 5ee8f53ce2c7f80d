export { analyseMesh, analyseMeshData, type MeshReport, type MeshOptions, type ClassCycle } from './analyseMesh';
export { surfaceChecks, orientTriangles, windingConsistent, type SurfaceChecks } from './surfaceChecks';
export { analyseMeshDataPacked } from './analyseMesh';
export { unpackCycle, unpackMeshReport, isPackedMeshReport, type PackedCycle, type PackedMeshReport } from './packedCycles';
