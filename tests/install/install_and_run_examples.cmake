# Run by ctest with cmake -P. Installs the build into SCRATCH/prefix and checks
# that each example builds and runs against the installed files alone.
cmake_minimum_required(VERSION 3.22)

function(run_checked what)
  cmake_parse_arguments(ARG "" "EXPECT_STATUS;WORKING_DIRECTORY" "COMMAND;EXPECT_OUTPUT" ${ARGN})
  if(NOT DEFINED ARG_EXPECT_STATUS)
    set(ARG_EXPECT_STATUS 0)
  endif()
  if(NOT ARG_WORKING_DIRECTORY)
    set(ARG_WORKING_DIRECTORY ${SCRATCH})
  endif()
  message(STATUS "${what}: ${ARG_COMMAND}")
  execute_process(COMMAND ${ARG_COMMAND} WORKING_DIRECTORY ${ARG_WORKING_DIRECTORY}
                  RESULT_VARIABLE status OUTPUT_VARIABLE out ERROR_VARIABLE err)
  if(NOT status STREQUAL "${ARG_EXPECT_STATUS}")
    message(FATAL_ERROR "${what}: exit status ${status}, expected ${ARG_EXPECT_STATUS}\nstdout:\n${out}\nstderr:\n${err}")
  endif()
  foreach(expected IN LISTS ARG_EXPECT_OUTPUT)
    string(FIND "${out}" "${expected}" at)
    if(at EQUAL -1)
      message(FATAL_ERROR "${what}: stdout lacks '${expected}'\nstdout:\n${out}\nstderr:\n${err}")
    endif()
  endforeach()
  message(STATUS "${what}: ok\n${out}")
endfunction()

file(REMOVE_RECURSE ${SCRATCH})
file(MAKE_DIRECTORY ${SCRATCH})
set(prefix ${SCRATCH}/prefix)
run_checked("install" COMMAND ${CMAKE_COMMAND} --install ${BUILD_DIR} --prefix ${prefix})

# The installed files, not the build tree, from here on.
file(GLOB_RECURSE config ${prefix}/*/stepframeConfig.cmake)
file(GLOB_RECURSE library ${prefix}/*/libstepframe.so)
file(GLOB_RECURSE pc_file ${prefix}/*/pkgconfig/stepframe.pc)
foreach(item config library pc_file)
  if(NOT ${item})
    message(FATAL_ERROR "the install lacks ${item}")
  endif()
endforeach()
foreach(required bin/stepframe include/stepframe/stepframe.h include/stepframe/stepframe.hpp
                 include/stepframe/analysis/section.hpp share/stepframe/sections/en10365_ipe.csv)
  if(NOT EXISTS ${prefix}/${required})
    message(FATAL_ERROR "the install lacks ${required}")
  endif()
endforeach()

# The demo project, copied so its results go to the scratch folder.
file(COPY ${SOURCE_DIR}/data/demo/platform.yaml ${SOURCE_DIR}/data/demo/platform.stp DESTINATION ${SCRATCH}/demo)
set(project ${SCRATCH}/demo/platform.yaml)

run_checked("installed command" COMMAND ${prefix}/bin/stepframe --version EXPECT_OUTPUT "stepframe ")

# C++ host: find_package(stepframe) with only the prefix on the search path.
run_checked("configure cpp_host" COMMAND ${CMAKE_COMMAND} -S ${SOURCE_DIR}/plugin/examples/cpp_host
            -B ${SCRATCH}/cpp_host -DCMAKE_BUILD_TYPE=Release -DCMAKE_PREFIX_PATH=${prefix}
            -Dstepframe_DIR=${prefix}/lib/cmake/stepframe)
run_checked("build cpp_host" COMMAND ${CMAKE_COMMAND} --build ${SCRATCH}/cpp_host -j 2)
run_checked("run cpp_host" COMMAND ${SCRATCH}/cpp_host/cpp_host ${project} ${SCRATCH}/cpp_out
            EXPECT_OUTPUT "pass, 21 members, 14 results")  # 3 cases, 3 combinations, 2 x 4 sway variants (5.3.2)
if(NOT EXISTS ${SCRATCH}/cpp_out/results.json)
  message(FATAL_ERROR "cpp_host wrote no results.json")
endif()

# C host: compiled with the flags the pkg-config file gives, loads the library with dlopen.
if(PKG_CONFIG)
  set(ENV{PKG_CONFIG_PATH} "")
  get_filename_component(pc_dir ${pc_file} DIRECTORY)
  set(ENV{PKG_CONFIG_PATH} ${pc_dir})
  execute_process(COMMAND ${PKG_CONFIG} --cflags stepframe OUTPUT_VARIABLE cflags RESULT_VARIABLE pc_status
                  OUTPUT_STRIP_TRAILING_WHITESPACE)
  # The include folder is given relative to the .pc file; it must resolve to the prefix's.
  string(REGEX MATCH "-I([^ ]+)" include_flag "${cflags}")
  get_filename_component(include_dir "${CMAKE_MATCH_1}" REALPATH)
  get_filename_component(expected_dir "${prefix}/include" REALPATH)
  if(NOT pc_status EQUAL 0 OR NOT include_dir STREQUAL expected_dir)
    message(FATAL_ERROR "pkg-config --cflags stepframe gave '${cflags}' (status ${pc_status}); expected -I${prefix}/include")
  endif()
  separate_arguments(cflags UNIX_COMMAND "${cflags}")
else()
  set(cflags -I${prefix}/include)
endif()
run_checked("build c_host" COMMAND ${C_COMPILER} -std=c11 -Wall -Wextra -Werror ${cflags}
            -o ${SCRATCH}/c_host ${SOURCE_DIR}/plugin/examples/c_host/main.c -ldl)
run_checked("run c_host" COMMAND ${SCRATCH}/c_host ${library} ${project} ${SCRATCH}/c_out
            EXPECT_OUTPUT "plug-in: stepframe" "sf_run_file: status 0: pass" "handle run: status 0")

# Python: the installed module only.
if(PYTHON)
  set(ENV{PYTHONPATH} ${prefix}/${PYTHON_DIR})
  run_checked("run the Python example" COMMAND ${PYTHON} -s ${SOURCE_DIR}/plugin/examples/python/run_project.py
              ${project} ${SCRATCH}/py_out EXPECT_OUTPUT "pass, 21 members, 14 results" "governing: member")
else()
  message(STATUS "the Python module was not built: Python example skipped")
endif()
file(REMOVE_RECURSE ${SCRATCH})
