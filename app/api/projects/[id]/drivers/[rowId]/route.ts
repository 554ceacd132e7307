import { registerRowRoutes } from '../../register-handlers';

export const { PUT, DELETE } = registerRowRoutes('drivers');
