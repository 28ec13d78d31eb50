-- lsp-check.lua: headless Neovim (0.7+) as an independent LSP client for the Stubwright server.
-- Adapted from the editor-harness Neovim probe. Started by test/lsp/neovim.test.ts:
--   nvim --headless --clean -n -i NONE -c 'luafile test/lsp/nvim/lsp-check.lua'
-- with these environment variables (JSON where noted):
--   CHECK_CMD       server command, JSON array, e.g. ["node","server/dist/server.js","--stdio"]
--   CHECK_FILE      the sheet to open
--   CHECK_HOVERS    JSON array of 0-based LSP positions {line, character}
--   CHECK_DIAGNOSTICS  wait until at least this many diagnostics are published (default 1)
--   CHECK_SETTINGS  JSON object answered as the `stubwright` section of workspace/configuration
--   CHECK_TIMEOUT_MS per-wait timeout (default 20000)
--   CHECK_OUT       where to write the result JSON
-- Result: { ok, server, capabilities, diagnostics[], hovers[], inlayHints[], errors[], exit, timingsMs }.
-- Positions in the result stay 0-based, as on the wire.

local uv = vim.loop
local env = function(k, d) local v = os.getenv(k); if v == nil or v == '' then return d end; return v end
local t0 = uv.hrtime()
local function ms() return math.floor((uv.hrtime() - t0) / 1e6) end

local out = env('CHECK_OUT')
local timeout = tonumber(env('CHECK_TIMEOUT_MS', '20000'))
local want = tonumber(env('CHECK_DIAGNOSTICS', '1'))
local result = { ok = false, diagnostics = {}, hovers = {}, inlayHints = vim.NIL, errors = {}, messages = {}, timingsMs = {} }

local function finish()
  result.timingsMs.total = ms()
  local f = assert(io.open(out, 'w'))
  f:write(vim.json.encode(result)); f:close()
  vim.cmd('qa!')
end

local ok, err = pcall(function()
  local cmd = vim.json.decode(env('CHECK_CMD'))
  local file = vim.fn.fnamemodify(env('CHECK_FILE'), ':p')
  vim.cmd('silent edit ' .. vim.fn.fnameescape(file))
  local bufnr = vim.api.nvim_get_current_buf()
  local uri = vim.uri_from_bufnr(bufnr)
  result.uri = uri
  vim.bo[bufnr].filetype = 'rfsheet'
  local root = vim.fn.fnamemodify(file, ':h')

  local caps = vim.lsp.protocol.make_client_capabilities()
  caps.textDocument.inlayHint = { dynamicRegistration = false }

  local last = nil
  local exited = nil
  local client_id = vim.lsp.start_client({
    name = 'stubwright',
    cmd = cmd,
    cmd_cwd = root,
    root_dir = root,
    capabilities = caps,
    settings = { stubwright = vim.json.decode(env('CHECK_SETTINGS', '{}')) },
    get_language_id = function() return 'rfsheet' end,
    handlers = {
      ['textDocument/publishDiagnostics'] = function(e, params, ctx, config)
        if params and params.uri == uri then
          last = params
          if #params.diagnostics > 0 and not result.timingsMs.diagnostics then result.timingsMs.diagnostics = ms() end
        end
        return vim.lsp.handlers['textDocument/publishDiagnostics'](e, params, ctx, config)
      end,
      ['window/logMessage'] = function(_, params) table.insert(result.messages, params) end,
    },
    on_init = function(_, init) result.server = init.serverInfo or vim.NIL end,
    on_exit = function(code, signal) exited = { code = code, signal = signal } end,
  })
  if not client_id then error('vim.lsp.start_client returned nil') end
  vim.lsp.buf_attach_client(bufnr, client_id)

  local client
  vim.wait(timeout, function()
    client = vim.lsp.get_client_by_id(client_id)
    return (client and client.initialized) or exited ~= nil
  end, 10)
  if not client or not client.initialized then error('server did not initialize: ' .. vim.inspect(exited)) end
  result.timingsMs.initialized = ms()
  local sc = client.server_capabilities or client.resolved_capabilities or {}
  result.capabilities = {
    hoverProvider = sc.hoverProvider or false,
    inlayHintProvider = sc.inlayHintProvider ~= nil,
    diagnosticProvider = sc.diagnosticProvider ~= nil,
  }

  vim.wait(timeout, function() return exited ~= nil or (last ~= nil and #last.diagnostics >= want) end, 10)
  if not last or #last.diagnostics < want then
    table.insert(result.errors, string.format('expected >= %d diagnostics, got %s', want, last and #last.diagnostics or 'no publish'))
  else
    result.diagnosticsVersion = last.version or vim.NIL
    for _, d in ipairs(last.diagnostics) do
      table.insert(result.diagnostics, { range = d.range, severity = d.severity, code = d.code or vim.NIL, source = d.source or vim.NIL, message = d.message })
    end
  end

  for _, pos in ipairs(vim.json.decode(env('CHECK_HOVERS', '[]'))) do
    local res, e = client.request_sync('textDocument/hover', { textDocument = { uri = uri }, position = pos }, timeout, bufnr)
    local h = { position = pos, text = vim.NIL }
    if not res then h.error = tostring(e)
    elseif res.err then h.error = vim.inspect(res.err)
    elseif res.result and res.result ~= vim.NIL then
      local c = res.result.contents
      h.text = type(c) == 'table' and (c.value or vim.inspect(c)) or c
      h.kind = type(c) == 'table' and c.kind or vim.NIL
      h.range = res.result.range or vim.NIL
    end
    table.insert(result.hovers, h)
  end

  local n = vim.api.nvim_buf_line_count(bufnr)
  local res, e = client.request_sync('textDocument/inlayHint', {
    textDocument = { uri = uri }, range = { start = { line = 0, character = 0 }, ['end'] = { line = n, character = 0 } },
  }, timeout, bufnr)
  if not res or res.err then table.insert(result.errors, 'inlayHint: ' .. tostring(e or vim.inspect(res.err)))
  else result.inlayHints = res.result end

  client.stop()
  vim.wait(5000, function() return exited ~= nil end, 10)
  result.exit = exited or vim.NIL
  result.ok = #result.errors == 0
end)
if not ok then table.insert(result.errors, 'lsp-check error: ' .. tostring(err)) end
finish()
