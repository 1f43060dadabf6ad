/* fuzz_config.c — libFuzzer harness for the configuration reader (src/cli/config.c): the
 * input is the key file named by --config, turned into command-line words. */
#include <stdint.h>
#include <stdio.h>
#include <sys/mman.h>
#include <unistd.h>

#include "cli/cli.h"

int LLVMFuzzerTestOneInput(const uint8_t *data, size_t size);

int LLVMFuzzerTestOneInput(const uint8_t *data, size_t size) {
  int fd = memfd_create("config", 0); /* a file without touching the disk */
  if (fd < 0 || write(fd, data, size) != (ssize_t)size) {
    if (fd >= 0)
      close(fd);
    return 0;
  }
  char path[64];
  snprintf(path, sizeof path, "/proc/self/fd/%d", fd);
  char *argv[] = {"plotproof", "scan", "--config", path, "x.pdf", NULL};
  int n = 0;
  char **words = pp_cli_config_argv(5, argv, &n);
  g_strfreev(words);
  close(fd);
  return 0;
}
