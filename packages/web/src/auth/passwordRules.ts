/** Shortest password the forms accept (the server enforces its own rule and names the field). */
export const PASSWORD_MIN = 10;
