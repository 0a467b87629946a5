/** Engine threads: shared-memory statevectors split over kernel helper threads. */
export { ParallelState, closeKernelPool, kernelPoolStatus } from "./kernel-pool";
export { engineThreads, threadsFor, PARALLEL_MIN_QUBITS } from "./config";
