#include "occt_messages.hpp"

#include <Message.hxx>
#include <Message_Gravity.hxx>
#include <Message_Messenger.hxx>
#include <Message_PrinterOStream.hxx>
#include <TCollection_AsciiString.hxx>

#include <spdlog/spdlog.h>

#include <mutex>

namespace stepframe::geometry::detail {

namespace {

std::string trimmed(const TCollection_AsciiString& text) {
  std::string line = text.ToCString();
  const auto is_space = [](char c) { return c == '\n' || c == '\r' || c == ' ' || c == '*'; };
  while (!line.empty() && is_space(line.back())) line.pop_back();
  std::size_t first = 0;
  while (first < line.size() && is_space(line[first])) ++first;
  return line.substr(first);
}

class SpdlogPrinter : public Message_Printer {
 public:
  SpdlogPrinter() { myTraceLevel = Message_Trace; }

 protected:
  void send(const TCollection_AsciiString& text, const Message_Gravity gravity) const override {
    const std::string line = trimmed(text);
    if (line.empty()) return;
    if (gravity >= Message_Alarm)
      spdlog::warn("OCCT: {}", line);
    else
      spdlog::debug("OCCT: {}", line);
  }
};

class CollectingPrinter : public Message_Printer {
 public:
  CollectingPrinter() { myTraceLevel = Message_Alarm; }
  const std::vector<std::string>& messages() const { return messages_; }

 protected:
  void send(const TCollection_AsciiString& text, const Message_Gravity gravity) const override {
    if (gravity < Message_Alarm) return;
    if (std::string line = trimmed(text); !line.empty()) messages_.push_back(std::move(line));
  }

 private:
  mutable std::vector<std::string> messages_;  // send() is const in OCCT's interface
};

}  // namespace

std::mutex& occt_exchange_lock() {
  static std::mutex lock;  // guards OCCT's process-wide state, nothing of ours
  return lock;
}

void route_occt_messages_to_spdlog() {
  static std::once_flag once;
  std::call_once(once, [] {
    const Handle(Message_Messenger)& messenger = Message::DefaultMessenger();
    messenger->RemovePrinters(STANDARD_TYPE(Message_PrinterOStream));
    messenger->AddPrinter(new SpdlogPrinter());
  });
}

OcctFailureLog::OcctFailureLog() : printer_(new CollectingPrinter()) {
  Message::DefaultMessenger()->AddPrinter(printer_);
}

OcctFailureLog::~OcctFailureLog() { Message::DefaultMessenger()->RemovePrinter(printer_); }

std::string OcctFailureLog::summary(std::size_t limit) const {
  const auto& messages = static_cast<const CollectingPrinter&>(*printer_).messages();
  std::string joined;
  for (std::size_t i = 0; i < messages.size() && i < limit; ++i) joined += (i == 0 ? "" : "; ") + messages[i];
  return joined;
}

std::vector<std::string> OcctFailureLog::all() const {
  return static_cast<const CollectingPrinter&>(*printer_).messages();
}

}  // namespace stepframe::geometry::detail
