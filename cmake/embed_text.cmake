# Writes a C++ source defining `std::string_view NAME()` that returns the text
# of INPUT, for files compiled into the program (the browser view's scripts).
#   cmake -DINPUT=file -DOUTPUT=file.cpp -DNAME=function -DNAMESPACE=ns -P embed_text.cmake
# The text goes in raw string literals of at most 60,000 characters each
# (compilers limit one literal's length), joined at compile time.
file(READ "${INPUT}" text)
string(FIND "${text}" ")embed\"" clash)
if(NOT clash EQUAL -1)
  message(FATAL_ERROR "${INPUT} contains the raw string delimiter )embed\"")
endif()
string(LENGTH "${text}" length)
set(body "")
set(offset 0)
while(offset LESS length)
  string(SUBSTRING "${text}" ${offset} 60000 piece)
  string(APPEND body "R\"embed(${piece})embed\"\n")
  math(EXPR offset "${offset} + 60000")
endwhile()
file(WRITE "${OUTPUT}.new" "// Generated from ${INPUT} by cmake/embed_text.cmake: do not edit.\n#include <string_view>\nnamespace ${NAMESPACE} {\nstd::string_view ${NAME}() {\n  static constexpr char text[] =\n${body};\n  return {text, sizeof(text) - 1};\n}\n}  // namespace ${NAMESPACE}\n")
file(RENAME "${OUTPUT}.new" "${OUTPUT}")
