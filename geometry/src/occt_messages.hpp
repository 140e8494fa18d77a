#pragma once
// OCCT reports through its own messenger, which prints to standard output by
// default. stepframe library code logs only through spdlog, so the STEP reader
// and writer route OCCT's messages there before they call OCCT.

#include <Message_Printer.hxx>
#include <Standard_Handle.hxx>

#include <mutex>
#include <string>
#include <vector>

namespace stepframe::geometry::detail {

/// Replaces the standard-stream printers of OCCT's default messenger with one
/// that forwards every message to spdlog (fails and alarms as warnings, the rest
/// at debug level). Safe to call many times and from several threads; the
/// replacement is made once per process.
void route_occt_messages_to_spdlog();

/// Held for the whole of every use of OCCT's data exchange (STEP parse and
/// transfer, XDE documents, the STEP writer, the messenger's printers): its
/// static protocol and session state and the default messenger are shared by
/// the process and not thread-safe, so such work runs one at a time. Hosts may
/// call the library from many threads; the rest of a run goes on in parallel.
std::mutex& occt_exchange_lock();

/// While alive, keeps the fail and alarm messages OCCT sends, so an error
/// message can quote what OCCT's parser said (e.g. the offending line).
class OcctFailureLog {
 public:
  OcctFailureLog();
  OcctFailureLog(const OcctFailureLog&) = delete;
  OcctFailureLog& operator=(const OcctFailureLog&) = delete;
  ~OcctFailureLog();

  /// The first `limit` messages joined with "; ", or empty when there were none.
  std::string summary(std::size_t limit = 3) const;
  /// Every message kept, in the order OCCT sent them.
  std::vector<std::string> all() const;

 private:
  Handle(Message_Printer) printer_;
};

}  // namespace stepframe::geometry::detail
