-- End-to-end check of the Ionwright language server with Neovim's built-in LSP client (Neovim 0.7+).
--
--   nvim --headless --clean -u NONE -n -S test/nvim/lsp_check.lua <note.md> <out.json> [hover text ...]
--
-- Starts `node dist/server.js --stdio` (the server path is found from this script's location; the
-- environment variables IONWRIGHT_SERVER and IONWRIGHT_NODE override the server file and the node
-- executable), opens <note.md> as a Markdown buffer, waits for the server's diagnostics, asks for a
-- hover on the first code span holding each [hover text] (default: NaCl), shuts the server down and
-- writes everything it saw to <out.json>. On any failure it still writes <out.json>, with an `error`
-- field, and exits non-zero. IONWRIGHT_NVIM_TIMEOUT_MS bounds each wait (default 15000 ms); a
-- watchdog bounds the whole run. IONWRIGHT_NVIM_REQUESTS names a JSON file of further requests (see
-- below: completion, definition, workspace symbols, code lenses).
--
-- Only Neovim 0.7 APIs are used (vim.lsp.start_client / buf_attach_client, not vim.lsp.start).

local started = vim.loop.hrtime()
local step_timeout = tonumber(os.getenv('IONWRIGHT_NVIM_TIMEOUT_MS') or '') or 15000
local watchdog_ms = 6 * step_timeout + 5000

-- Paths: arguments are made absolute against the current directory; the server is found from here.
local this_file = debug.getinfo(1, 'S').source:gsub('^@', '')
local repo_root = vim.fn.fnamemodify(this_file, ':p:h:h:h')
local args = vim.fn.argv()
local note_path = args[1] and vim.fn.fnamemodify(args[1], ':p') or nil
local out_path = args[2] and vim.fn.fnamemodify(args[2], ':p') or nil
local hover_targets = {}
for i = 3, #args do
  table.insert(hover_targets, args[i])
end
if #hover_targets == 0 then
  hover_targets = { 'NaCl' }
end
local server_path = os.getenv('IONWRIGHT_SERVER') or (repo_root .. '/dist/server.js')
local node = os.getenv('IONWRIGHT_NODE') or 'node'

local report = {
  nvim = tostring(vim.version().major) .. '.' .. vim.version().minor .. '.' .. vim.version().patch,
  note = note_path,
  server = server_path,
  published = {}, -- raw textDocument/publishDiagnostics params, in arrival order
  diagnostics = {}, -- the last publication for the note, in LSP shape (0-based UTF-16 ranges)
  nvim_diagnostics = {}, -- the same as Neovim stores them (0-based byte columns) with the text they cover
  hovers = {},
  server_requests = {}, -- requests the server sent to the client (method names, in order)
  log = {}, -- window/logMessage and window/showMessage from the server
}

local finished = false

local function write_report()
  report.duration_ms = math.floor((vim.loop.hrtime() - started) / 1e6)
  local ok, encoded = pcall(vim.fn.json_encode, report)
  if not ok then
    encoded = vim.fn.json_encode({ error = 'could not encode the report: ' .. tostring(encoded) })
  end
  if not out_path then
    io.stderr:write(encoded .. '\n')
    return
  end
  local f = io.open(out_path, 'w')
  if f then
    f:write(encoded)
    f:close()
  else
    io.stderr:write('lsp_check: cannot write ' .. out_path .. '\n' .. encoded .. '\n')
  end
end

local client_id

--- Writes the report once and leaves Neovim: `qa!` on success, `cquit` (exit status 1) on failure.
local function finish(err)
  if finished then
    return
  end
  finished = true
  if err then
    report.error = tostring(err)
    io.stderr:write('lsp_check: ' .. report.error .. '\n')
  end
  write_report()
  if err then
    if client_id then
      pcall(vim.lsp.stop_client, client_id, true)
    end
    vim.cmd('cquit')
  else
    vim.cmd('qa!')
  end
end

-- Watchdog: whatever happens, the run ends with a report.
vim.defer_fn(function()
  finish(string.format('watchdog: the check did not finish within %d ms', watchdog_ms))
end, watchdog_ms)

--- Fails the check with a message (no traceback: these are expected failures, not bugs here).
local function fail(message)
  error({ message = message }, 0)
end

local function wait_for(what, condition)
  local ok = vim.wait(step_timeout, condition, 20)
  if not ok then
    fail(string.format('timed out after %d ms waiting for %s', step_timeout, what))
  end
end

--- Number of UTF-16 code units in a UTF-8 string (4-byte sequences are surrogate pairs).
--- Written out rather than using vim.str_utfindex, whose signature changed after 0.10.
local function utf16_length(s)
  local n = 0
  for i = 1, #s do
    local b = s:byte(i)
    if b < 0x80 or (b >= 0xC0 and b < 0xF0) then
      n = n + 1
    elseif b >= 0xF0 then
      n = n + 2
    end -- 0x80..0xBF: continuation byte
  end
  return n
end

--- The 0-based line and UTF-16 character one character into the first code span holding `text`
--- (or into the first bare `text`), so that the position is inside it and not on its boundary.
local function position_of(bufnr, text)
  local lines = vim.api.nvim_buf_get_lines(bufnr, 0, -1, false)
  for _, needle in ipairs({ '`' .. text .. '`', text }) do
    local skip = needle:sub(1, 1) == '`' and 1 or 0
    for lnum, line in ipairs(lines) do
      local s = line:find(needle, 1, true)
      if s then
        local first = s + skip -- 1-based byte index of the text's first character (ASCII in practice)
        return { line = lnum - 1, character = utf16_length(line:sub(1, first)) }
      end
    end
  end
  return nil
end

--- The buffer text covered by a Neovim diagnostic (byte columns, possibly spanning lines).
local function text_of(bufnr, d)
  local ok, parts = pcall(vim.api.nvim_buf_get_text, bufnr, d.lnum, d.col, d.end_lnum, d.end_col, {})
  if not ok then
    return vim.NIL
  end
  return table.concat(parts, '\n')
end

local function main()
  -- Keep Neovim's LSP log quiet; what matters is collected here and written to <out.json>.
  -- ('OFF' exists from Neovim 0.8; 0.7 stops at 'ERROR'.)
  if not pcall(vim.lsp.set_log_level, 'OFF') then
    vim.lsp.set_log_level('ERROR')
  end
  if not note_path or not out_path then
    fail('usage: nvim --headless --clean -u NONE -S lsp_check.lua <note.md> <out.json> [hover text ...]')
  end
  if vim.fn.filereadable(note_path) ~= 1 then
    fail('cannot read the note ' .. note_path)
  end
  if vim.fn.filereadable(server_path) ~= 1 then
    fail('cannot find the server ' .. server_path .. ' (run npm run build first)')
  end
  if vim.fn.executable(node) ~= 1 then
    fail('cannot run ' .. node)
  end

  vim.o.swapfile = false -- never stop at a swap-file prompt (the test also passes -n)
  vim.cmd('silent edit ' .. vim.fn.fnameescape(note_path))
  local bufnr = vim.api.nvim_get_current_buf()
  -- With -u NONE no filetype detection runs; the server is told the language through the filetype.
  vim.bo[bufnr].filetype = 'markdown'
  local uri = vim.uri_from_bufnr(bufnr)
  report.uri = uri

  local exit_info
  local initialized = false
  local function record_request(method, default)
    return function(err, result, ctx, config)
      table.insert(report.server_requests, method)
      return default(err, result, ctx, config)
    end
  end

  client_id = vim.lsp.start_client({
    name = 'ionwright',
    cmd = { node, server_path, '--stdio' },
    root_dir = vim.fn.fnamemodify(note_path, ':h'),
    offset_encoding = 'utf-16',
    flags = { debounce_text_changes = 50, exit_timeout = 2000 },
    handlers = {
      ['textDocument/publishDiagnostics'] = function(err, result, ctx, config)
        table.insert(report.published, result)
        return vim.lsp.handlers['textDocument/publishDiagnostics'](err, result, ctx, config)
      end,
      ['window/logMessage'] = function(_, result)
        table.insert(report.log, result)
      end,
      ['window/showMessage'] = function(_, result)
        table.insert(report.log, result)
      end,
      ['workspace/configuration'] = record_request('workspace/configuration', vim.lsp.handlers['workspace/configuration']),
      ['client/registerCapability'] = record_request('client/registerCapability', vim.lsp.handlers['client/registerCapability']),
      ['window/workDoneProgress/create'] = record_request('window/workDoneProgress/create', vim.lsp.handlers['window/workDoneProgress/create']),
    },
    on_init = function(client, result)
      initialized = true
      report.server_info = result and result.serverInfo or vim.NIL
      local caps = result and result.capabilities or {}
      report.capabilities = {
        hoverProvider = caps.hoverProvider or false,
        textDocumentSync = caps.textDocumentSync or vim.NIL,
        codeActionProvider = caps.codeActionProvider and true or false,
        documentSymbolProvider = caps.documentSymbolProvider and true or false,
      }
      report.offset_encoding = client.offset_encoding
    end,
    on_exit = function(code, signal)
      exit_info = { code = code, signal = signal }
    end,
  })
  if not client_id then
    fail('vim.lsp.start_client did not start the server')
  end

  if not vim.lsp.buf_attach_client(bufnr, client_id) then
    fail('vim.lsp.buf_attach_client failed')
  end
  wait_for('the server to initialise', function()
    return initialized or exit_info ~= nil
  end)
  if exit_info then
    fail(string.format('the server exited during start-up (code %s, signal %s)', tostring(exit_info.code), tostring(exit_info.signal)))
  end

  -- The latest publication for this document (the server validates on open).
  local function last_publication()
    for i = #report.published, 1, -1 do
      local p = report.published[i]
      if p.uri == uri then
        return p
      end
    end
    return nil
  end
  wait_for('textDocument/publishDiagnostics for ' .. uri, function()
    return last_publication() ~= nil or exit_info ~= nil
  end)
  if exit_info then
    fail('the server exited before publishing diagnostics')
  end
  for _, d in ipairs(last_publication().diagnostics or {}) do
    table.insert(report.diagnostics, {
      code = d.code,
      source = d.source,
      severity = d.severity,
      message = d.message,
      range = d.range,
    })
  end
  -- Neovim's own view, after its UTF-16 → byte conversion; vim.diagnostic.get is filled synchronously
  -- by the publishDiagnostics handler above.
  for _, d in ipairs(vim.diagnostic.get(bufnr)) do
    table.insert(report.nvim_diagnostics, {
      code = d.code,
      source = d.source,
      severity = d.severity,
      lnum = d.lnum,
      col = d.col,
      end_lnum = d.end_lnum,
      end_col = d.end_col,
      text = text_of(bufnr, d),
    })
  end

  for _, target in ipairs(hover_targets) do
    local entry = { target = target }
    table.insert(report.hovers, entry)
    local pos = position_of(bufnr, target)
    if not pos then
      fail('hover target not found in the note: ' .. target)
    end
    entry.position = pos
    local params = { textDocument = { uri = uri }, position = pos }
    local responses, err = vim.lsp.buf_request_sync(bufnr, 'textDocument/hover', params, step_timeout)
    if not responses then
      fail('textDocument/hover at ' .. target .. ' failed: ' .. tostring(err))
    end
    local response = responses[client_id]
    if not response then
      fail('no hover response from the ionwright client for ' .. target)
    end
    if response.error then
      entry.error = response.error
      fail('textDocument/hover at ' .. target .. ' answered with an error: ' .. vim.inspect(response.error))
    end
    local result = response.result
    if result == nil or result == vim.NIL then
      entry.markdown = vim.NIL
    else
      local contents = result.contents
      entry.kind = type(contents) == 'table' and contents.kind or vim.NIL
      entry.markdown = type(contents) == 'table' and contents.value or contents
      entry.range = result.range or vim.NIL
    end
  end

  -- Further requests, from the JSON file named by IONWRIGHT_NVIM_REQUESTS: a list of
  -- {method, target, at, params}. The position is `at` UTF-16 units into the first occurrence of
  -- `target` in the note (a plain search); `params` is merged into {textDocument, position}. Each answer
  -- is recorded in report.requests, in order. A `jump` entry also lets Neovim jump to the first location
  -- of the answer (vim.lsp.util.jump_to_location) and records where the cursor went.
  report.requests = {}
  local requests_file = os.getenv('IONWRIGHT_NVIM_REQUESTS')
  if requests_file and requests_file ~= '' then
    local f = io.open(requests_file, 'r')
    if not f then
      fail('cannot read ' .. requests_file)
    end
    local list = vim.fn.json_decode(f:read('*a'))
    f:close()
    local lines = vim.api.nvim_buf_get_lines(bufnr, 0, -1, false)
    for _, r in ipairs(list) do
      local entry = { method = r.method, target = r.target }
      table.insert(report.requests, entry)
      local params = { textDocument = { uri = uri } }
      if r.target and r.target ~= vim.NIL then
        local found
        for lnum, line in ipairs(lines) do
          local s = line:find(r.target, 1, true)
          if s then
            found = { line = lnum - 1, character = utf16_length(line:sub(1, s - 1)) + (r.at or 0) }
            break
          end
        end
        if not found then
          fail('request target not found in the note: ' .. r.target)
        end
        params.position = found
        entry.position = found
      end
      for k, v in pairs(r.params or {}) do
        params[k] = v
      end
      local responses, err = vim.lsp.buf_request_sync(bufnr, r.method, params, step_timeout)
      if not responses then
        fail(r.method .. ' failed: ' .. tostring(err))
      end
      local response = responses[client_id]
      if not response then
        fail('no ' .. r.method .. ' response from the ionwright client')
      end
      if response.error then
        fail(r.method .. ' answered with an error: ' .. vim.inspect(response.error))
      end
      entry.result = response.result == nil and vim.NIL or response.result
      if r.jump and type(response.result) == 'table' and response.result[1] then
        vim.lsp.util.jump_to_location(response.result[1], 'utf-16')
        local cursor = vim.api.nvim_win_get_cursor(0)
        entry.jumped = { buffer = vim.api.nvim_buf_get_name(0), line = cursor[1] - 1, byte_col = cursor[2] }
        vim.api.nvim_set_current_buf(bufnr)
      end
    end
  end

  -- Orderly shutdown (shutdown request, exit notification) and the server's exit status.
  vim.lsp.stop_client(client_id)
  wait_for('the server to exit after shutdown/exit', function()
    return exit_info ~= nil
  end)
  report.server_exit = exit_info
end

local function run()
  local ok, err = xpcall(main, function(e)
    if type(e) == 'table' and e.message then
      return e.message
    end
    return debug.traceback(tostring(e), 2)
  end)
  finish(not ok and err or nil)
end

-- Run once start-up is over (the script is sourced during start-up by -S).
if vim.v.vim_did_enter == 1 then
  vim.schedule(run)
else
  vim.api.nvim_create_autocmd('VimEnter', { once = true, callback = function() vim.schedule(run) end })
end
