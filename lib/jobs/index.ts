export { getBoss, stopBoss, QUEUES, BOSS_SCHEMA } from './boss';
export { enqueueScreening, startWorker, stopWorker, type ScreeningJobData } from './screening-queue';
