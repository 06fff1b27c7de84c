/** Version of the statistics core; stored with every audit so its numbers can be traced. */
export const CORE_VERSION = '1.0.0';
