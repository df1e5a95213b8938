// cache.hpp - a small thread-safe LRU memo of expensive results, keyed by the
// exact inputs (so it can never return a stale result: any change of a count
// or an option is a different key).
//
// A sheet often asks several functions about the same ranges (RATES.SAME.P,
// RATES.SAME.REPORT and RATES.CHECK beside each other); with the cache the
// second and third cost a lookup. The engine has no global cache: the UNO
// component owns one and passes it in.
#pragma once

#include <list>
#include <map>
#include <mutex>
#include <optional>
#include <utility>

namespace tallyrates {

template <class Key, class Value>
class lru_cache {
public:
    explicit lru_cache(std::size_t capacity = 64) : capacity_(capacity) {}

    std::optional<Value> find(const Key& key) {
        std::lock_guard lock(mutex_);
        const auto it = index_.find(key);
        if (it == index_.end()) return std::nullopt;
        items_.splice(items_.begin(), items_, it->second);  // most recently used first
        return it->second->second;
    }

    void put(const Key& key, const Value& value) {
        std::lock_guard lock(mutex_);
        if (const auto it = index_.find(key); it != index_.end()) {
            it->second->second = value;
            items_.splice(items_.begin(), items_, it->second);
            return;
        }
        items_.emplace_front(key, value);
        index_.emplace(key, items_.begin());
        if (items_.size() > capacity_) {
            index_.erase(items_.back().first);
            items_.pop_back();
        }
    }

    std::size_t size() {
        std::lock_guard lock(mutex_);
        return items_.size();
    }

private:
    std::size_t capacity_;
    std::mutex mutex_;
    std::list<std::pair<Key, Value>> items_;
    std::map<Key, typename std::list<std::pair<Key, Value>>::iterator> index_;
};

}  // namespace tallyrates
