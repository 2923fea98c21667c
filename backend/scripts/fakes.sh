# Local stand-ins for outside services, started on loopback by start.sh and test.sh.
# Sourced: defines start_fakes, which appends the PIDs it starts to PIDS and exports their addresses.
start_fakes() {
  : # payment and mail fakes are added here by the permit and escort work
}
