/// <reference lib="webworker" />
// The engine's home off the main thread: a thin adapter exposing the compute
// service over comlink. Cancel is the main thread terminating this worker.
import * as Comlink from 'comlink';
import { createComputeService } from '../compute/computeService';
import { openDb } from '../store';

Comlink.expose(createComputeService(openDb()));
