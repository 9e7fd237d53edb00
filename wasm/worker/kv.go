//go:build js && wasm

package main

import (
	"fmt"

	"github.com/syumai/workers/cloudflare/kv"

	"gibbsheet/wasm/worker/service"
)

// binding is the name of the KV namespace binding in wrangler.toml.
const binding = "WORKSHEETS"

// kvStore is a service.Store on a Workers KV namespace. Documents are stored as text: the service only
// stores valid UTF-8, which passes through JavaScript strings unchanged.
type kvStore struct {
	binding string
}

func (s kvStore) namespace() (*kv.Namespace, error) {
	ns, err := kv.NewNamespace(s.binding)
	if err != nil {
		return nil, fmt.Errorf("KV namespace %s is not bound: %w", s.binding, err)
	}
	return ns, nil
}

// missing is what kv.Namespace.GetString returns for an absent key: the text of a JavaScript null as
// syscall/js writes it. A stored document is a JSON object, so it can never be this text.
const missing = "<null>"

func (s kvStore) Get(id string) ([]byte, error) {
	ns, err := s.namespace()
	if err != nil {
		return nil, err
	}
	v, err := ns.GetString(id, nil)
	if err != nil {
		return nil, fmt.Errorf("KV get: %w", err)
	}
	if v == missing {
		return nil, service.ErrNotFound
	}
	return []byte(v), nil
}

func (s kvStore) Put(id string, doc []byte) error {
	ns, err := s.namespace()
	if err != nil {
		return err
	}
	if err := ns.PutString(id, string(doc), nil); err != nil {
		return fmt.Errorf("KV put: %w", err)
	}
	return nil
}
