-- wrk script: POST one arith@1 call, asking for the bare text answer.
wrk.method = "POST"
wrk.body = '{"expr":"1250/4000"}'
wrk.headers["Content-Type"] = "application/json"
wrk.headers["Accept"] = "text/plain"
