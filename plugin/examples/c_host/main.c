/* A plug-in host in plain C that discovers stepframe with dlopen:
 *   cc -o c_host main.c -I<prefix>/include -ldl
 *   c_host <prefix>/lib/libstepframe.so PROJECT.yaml OUT_DIR
 * Only the header's types are used at compile time; every function is looked
 * up at run time, as a host that loads plug-ins by path does. */
#include <stepframe/stepframe.h>

#include <dlfcn.h>
#include <stdio.h>
#include <string.h>

typedef const sf_plugin_info *(*descriptor_fn)(void);
typedef int (*run_file_fn)(const char *, const char *, char *, size_t);
typedef sf_run *(*run_new_fn)(void);
typedef void (*run_free_fn)(sf_run *);
typedef int (*run_project_fn)(sf_run *, const char *);
typedef int (*set_progress_fn)(sf_run *, sf_progress_fn, void *);
typedef size_t (*copy_json_fn)(const sf_run *, char *, size_t);

static int on_progress(const char *stage, double fraction, void *user_data) {
  int *calls = (int *)user_data;
  ++*calls;
  if (fraction == 0.0) fprintf(stderr, "[c_host] %s\n", stage);
  return 0; /* non-zero would cancel */
}

int main(int argc, char **argv) {
  if (argc < 4) {
    fprintf(stderr, "usage: c_host LIBSTEPFRAME.so PROJECT.yaml OUT_DIR\n");
    return 2;
  }
  void *plugin = dlopen(argv[1], RTLD_NOW | RTLD_LOCAL);
  if (!plugin) {
    fprintf(stderr, "[c_host] cannot load %s: %s\n", argv[1], dlerror());
    return 2;
  }
  descriptor_fn descriptor = (descriptor_fn)dlsym(plugin, "sf_plugin_descriptor");
  if (!descriptor) {
    fprintf(stderr, "[c_host] %s is not a stepframe plug-in\n", argv[1]);
    return 2;
  }
  const sf_plugin_info *info = descriptor();
  if (info->abi_version != SF_ABI_VERSION) {
    fprintf(stderr, "[c_host] %s has ABI %d, this host needs %d\n", info->name, info->abi_version, SF_ABI_VERSION);
    return 2;
  }
  printf("plug-in: %s %s (ABI %d): %s\n", info->name, info->version, info->abi_version, info->description);

  /* The one-call way: run, write files, get the status and a message. */
  run_file_fn run_file = (run_file_fn)dlsym(plugin, "sf_run_file");
  char message[512];
  int status = run_file(argv[2], argv[3], message, sizeof message);
  printf("sf_run_file: status %d: %s\n", status, message);

  /* With a handle: progress and the results as a JSON string. */
  run_new_fn run_new = (run_new_fn)dlsym(plugin, "sf_run_new");
  run_free_fn run_free = (run_free_fn)dlsym(plugin, "sf_run_free");
  run_project_fn run_project = (run_project_fn)dlsym(plugin, "sf_run_project_file");
  set_progress_fn set_progress = (set_progress_fn)dlsym(plugin, "sf_run_set_progress");
  copy_json_fn copy_json = (copy_json_fn)dlsym(plugin, "sf_run_copy_results_json");
  sf_run *run = run_new();
  int calls = 0;
  set_progress(run, on_progress, &calls);
  int again = run_project(run, argv[2]);
  size_t length = copy_json(run, NULL, 0);
  char head[81];
  copy_json(run, head, sizeof head);
  printf("handle run: status %d, %d progress calls, results JSON %zu bytes: %s...\n", again, calls, length, head);
  run_free(run);
  dlclose(plugin);
  return status == again ? status : 4;
}
