export { default } from '@/app/(workspace)/page-skeleton';
