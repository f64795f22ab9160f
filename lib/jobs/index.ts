export { getBoss, stopBoss, QUEUES, BOSS_SCHEMA } from './boss';
export { enqueueScreening, startWorker, stopWorker, type ScreeningJobData } from './screening-queue';
export { startNotifyWorker, stopNotifyWorker, drainOutboxNow, runDigestNow, kickNotifications, NOTIFY_QUEUES } from './notify-queue';
