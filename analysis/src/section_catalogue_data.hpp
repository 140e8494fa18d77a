#pragma once
// Private: the section catalogue CSV files, compiled into the library at build
// time (see analysis/CMakeLists.txt and analysis/cmake/section_catalogue_data.cpp.in).

#include <span>
#include <string_view>

namespace stepframe::analysis::detail {

struct EmbeddedTable {
  std::string_view file;  ///< file name under data/sections/
  std::string_view text;  ///< its full contents
};

/// Every data/sections/*.csv file, in file-name order.
std::span<const EmbeddedTable> embedded_section_tables();

}  // namespace stepframe::analysis::detail
