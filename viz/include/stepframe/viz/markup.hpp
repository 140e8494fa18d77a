#pragma once
// Text placed in XML and HTML documents (the .vtm index, the report).

#include <string>
#include <string_view>

namespace stepframe::viz {

/// `text` with &, <, > and " written as character references.
std::string escape_markup(std::string_view text);

}  // namespace stepframe::viz
