package service

import (
	"bytes"
	"sync"
)

// MemoryStore is a Store that keeps documents in memory: for tests and for running the handler with
// net/http outside the Workers runtime. The zero value is ready to use.
type MemoryStore struct {
	mu   sync.Mutex
	docs map[string][]byte
}

// Get returns the document stored under id, or ErrNotFound.
func (s *MemoryStore) Get(id string) ([]byte, error) {
	s.mu.Lock()
	defer s.mu.Unlock()
	doc, ok := s.docs[id]
	if !ok {
		return nil, ErrNotFound
	}
	return doc, nil
}

// Put stores a copy of doc under id.
func (s *MemoryStore) Put(id string, doc []byte) error {
	s.mu.Lock()
	defer s.mu.Unlock()
	if s.docs == nil {
		s.docs = map[string][]byte{}
	}
	s.docs[id] = bytes.Clone(doc)
	return nil
}
