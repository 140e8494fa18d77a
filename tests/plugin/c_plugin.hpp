#pragma once
// libstepframe.so loaded with dlopen, as a plug-in host loads it.

#include <catch2/catch.hpp>

#include <dlfcn.h>

namespace stepframe::test {

/// The shared library, loaded once for the test program.
class Plugin {
 public:
  Plugin() : handle_(dlopen(STEPFRAME_SHARED_LIB, RTLD_NOW | RTLD_LOCAL)) {
    if (!handle_) FAIL("cannot load " << STEPFRAME_SHARED_LIB << ": " << dlerror());
  }
  ~Plugin() {
    if (handle_) dlclose(handle_);
  }
  Plugin(const Plugin&) = delete;
  Plugin& operator=(const Plugin&) = delete;

  template <class F>
  F* get(const char* name) const {
    void* symbol = dlsym(handle_, name);
    if (!symbol) FAIL("libstepframe.so has no symbol " << name);
    return reinterpret_cast<F*>(symbol);
  }

 private:
  void* handle_;
};

inline const Plugin& plugin() {
  static const Plugin loaded;
  return loaded;
}

}  // namespace stepframe::test
