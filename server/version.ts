/** The service's version; a test keeps it equal to package.json's. */
export const SERVICE_VERSION = "0.1.0";
