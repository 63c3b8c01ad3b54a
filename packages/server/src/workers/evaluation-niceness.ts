/**
 * Nice value of the sweep and comparison workers' evaluation threads (0 normal … 19 lowest). A
 * worker embedded in the web server shares its cores with the request thread; at 10 the scheduler
 * gives a request the core first (the Linux CFS scheduler weighs nice 10 at 110 against 1024 at
 * nice 0 — sched_prio_to_weight in kernel/sched/core.c — so on a contended core an evaluation
 * thread gets about a tenth of it), while on an otherwise idle core the threads run at full speed. Common practice for batch
 * work beside interactive work; Linux keeps the value per thread, so only the pool's threads are lowered.
 */
export const EVALUATION_NICENESS = 10;
