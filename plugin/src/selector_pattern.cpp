#include "selector_pattern.hpp"

#include <re2/re2.h>

#include <stdexcept>

namespace stepframe::detail {

SelectorPattern::SelectorPattern(const std::string& pattern) {
  RE2::Options options;
  options.set_case_sensitive(false);
  options.set_log_errors(false);  // the reason goes into the exception instead
  auto re = std::make_shared<const re2::RE2>(pattern, options);
  if (!re->ok()) throw std::invalid_argument(re->error());
  re_ = std::move(re);
}

bool SelectorPattern::matches(std::string_view value) const {
  return RE2::FullMatch(re2::StringPiece(value.data(), value.size()), *re_);
}

}  // namespace stepframe::detail
