/** Version of the ladder engine's methods; stored with every computed report so results can be traced. */
export const ENGINE_VERSION = '1.5.0';
