// A value built from inputs and rebuilt only when the inputs differ from those of the last
// build: the viewer's derived data (surface, glyphs, cut, ...) is never stale and never rebuilt
// for nothing. The key is a small struct of the inputs with a defaulted operator==.
#pragma once
#include <optional>
#include <utility>

namespace ellipsa::viewer {

template <class Key, class Value>
class Keyed {
public:
    // Build the value with `build()` unless `key` equals the key of the last build. Returns true
    // when it built.
    template <class Build>
    bool update(const Key& key, Build&& build) {
        if (key_ && *key_ == key) return false;
        value_ = std::forward<Build>(build)();
        key_ = key;
        return true;
    }
    const Value& value() const { return value_; }
    Value& value() { return value_; }
    const std::optional<Key>& key() const { return key_; }
    void clear() {
        key_.reset();
        value_ = Value{};
    }

private:
    std::optional<Key> key_;
    Value value_{};
};

}  // namespace ellipsa::viewer
