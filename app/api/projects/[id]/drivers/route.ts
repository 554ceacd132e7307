import { registerRoutes } from '../register-handlers';

export const { GET, POST } = registerRoutes('drivers');
