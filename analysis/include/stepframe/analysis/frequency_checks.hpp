#pragma once
// Natural-frequency checks with limits the project sets: a lowest frequency
// for floors and walkways that people walk on, and a separation band around
// the running frequency of machines (no mode within +-band of it). Both are
// common practice; the limits depend on use, codes and the machine maker, so
// stepframe has no default that would pretend to be a code value.
//
// A check applies to the modes that move its members: a mode counts when
// its largest translation at any point of those members (ends and the points
// the modal analysis divided them at) is at least `engaged_share` of the
// mode's largest translation anywhere (stepframe's own rule; every member
// when the check names none).

#include "stepframe/analysis/checks.hpp"
#include "stepframe/analysis/frame_model.hpp"
#include "stepframe/analysis/natural_frequencies.hpp"

#include <optional>
#include <stdexcept>
#include <string>
#include <vector>

namespace stepframe::analysis {

inline constexpr double engaged_share = 0.1;

struct FrequencyLimit {
  std::string label;                  ///< for the result's `check`, e.g. "frequency (checks.frequency[0])"
  std::vector<std::size_t> members;   ///< the members (indices into member_chains); empty: all
  std::optional<double> min_hz;       ///< lowest frequency allowed [Hz]
  std::optional<double> running_hz;   ///< a machine's running frequency [Hz]
  double band = 0.2;                  ///< half-width of the separation band, a fraction of running_hz
};

/// Thrown when the modes found do not reach far enough to decide a check
/// (every mode found is below the band's upper end, or below min_hz with none
/// of them moving the members): ask for more modes.
class ModesTooFew : public std::runtime_error {
 public:
  using std::runtime_error::runtime_error;
};

/// One CheckResult per limit (member whole_frame, unit "Hz", `combination`
/// = mass_label): min_hz: value = the lowest frequency of a mode moving the
/// members, utilisation = min_hz / value; band: value = the frequency of such
/// a mode nearest running_hz, utilisation = band / (|value - running_hz| / running_hz).
/// Throws ModesTooFew (above).
std::vector<CheckResult> check_frequencies(const FrameModel& model, const ModalResult& modes,
                                           const std::vector<FrequencyLimit>& limits, const std::string& mass_label);

}  // namespace stepframe::analysis
