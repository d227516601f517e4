#!/usr/bin/env python3
"""Sweep the continuous-phase flow of one T-junction through the Dropwright API and print a CSV table.

Standard library only (urllib). Needs a personal API token (account page -> API tokens):

    DW_URL=http://127.0.0.1:3000 DW_TOKEN=dwt_... python3 docs/examples/flow_sweep.py

Writes one line per flow rate: continuous flow (uL/min), regime, droplet diameter (um), frequency (Hz).
Forecasts are estimates with a stated domain of validity (see docs/forecast-api.md); check them on the bench
before you rely on them, and follow your lab's rules for pumps and pressure.
"""
import csv
import json
import os
import sys
import urllib.error
import urllib.request

BASE = os.environ.get("DW_URL", "http://127.0.0.1:3000").rstrip("/")
TOKEN = os.environ.get("DW_TOKEN", "")
FLOWS_UL_MIN = [float(f) for f in os.environ.get("DW_FLOWS", "2 5 10 20 40").split()]

JUNCTION = {
    "junction": {"kind": "t-junction", "mainWidth": "100 um", "inletWidth": "50 um", "depth": "50 um"},
    "continuous": {"viscosity": "3 mPa*s", "density": "800 kg/m^3"},
    "dispersed": {"liquid": "water"},
    "interfacialTension": "5 mN/m",
    "contactAngle": "150 deg",
    "temperature": "20 degC",
    "model": {"alpha": 1},
}


def forecast(continuous_ul_min: float) -> dict:
    body = dict(JUNCTION, flow={"continuous": f"{continuous_ul_min} uL/min", "dispersed": "5 uL/min"})
    request = urllib.request.Request(
        f"{BASE}/api/v1/forecast",
        data=json.dumps(body).encode(),
        headers={"Authorization": f"Bearer {TOKEN}", "Content-Type": "application/json"},
        method="POST",
    )
    try:
        with urllib.request.urlopen(request, timeout=60) as answer:
            return json.load(answer)
    except urllib.error.HTTPError as error:
        sys.exit(f"{error.code} from {BASE}: {json.load(error).get('message')}")


def main() -> None:
    if not TOKEN:
        sys.exit("Set DW_TOKEN to a personal API token (account page -> API tokens)")
    out = csv.writer(sys.stdout)
    out.writerow(["continuous_ul_min", "regime", "droplet_diameter_um", "frequency_hz"])
    for flow in FLOWS_UL_MIN:
        result = forecast(flow)
        diameter = result.get("dropletDiameter", {}).get("value")
        frequency = result.get("frequency", {}).get("value")
        out.writerow([
            flow,
            result["regime"]["value"],
            "" if diameter is None else f"{diameter * 1e6:.3f}",
            "" if frequency is None else f"{frequency:.4g}",
        ])


if __name__ == "__main__":
    main()
