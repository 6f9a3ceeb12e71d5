// How the one-time Debian packages get installed. Plain Node with no dependencies.

/**
 * What to do about packages that need root, from the facts of this run:
 *  - 'direct': we are root, run apt-get;
 *  - 'sudo':   sudo works without a password prompt, or the person said yes to using it;
 *  - 'ask':    sudo will ask for a password and someone is at the terminal: ask them first;
 *  - 'print':  no way to become root here (or they said no): print the command and stop.
 * `answer` is what they typed when asked (undefined before asking).
 */
export function installDecision({ isRoot, hasSudo, sudoNeedsPassword, isTTY, answer }) {
  if (isRoot) return 'direct';
  if (!hasSudo) return 'print';
  if (!sudoNeedsPassword) return 'sudo';
  if (!isTTY) return 'print';
  if (answer === undefined) return 'ask';
  return /^\s*y(es)?\s*$/i.test(answer) ? 'sudo' : 'print';
}

/** The one command a person can run themselves. */
export function aptCommandLine(packages) {
  return `sudo apt-get update && sudo apt-get install -y --no-install-recommends ${packages.join(' ')}`;
}
