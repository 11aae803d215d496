"""Reproducible random scores in fixed chunks of iterations.

Chunk c (iterations c·CHUNK … (c+1)·CHUNK − 1) draws from its own generator, seeded by
``SeedSequence(seed, spawn_key=(c,))`` (the c-th child of ``SeedSequence(seed)``). Blocks of
the simulation are whole chunks, so the draws — and every per-chunk sum — are the same
whatever the block size.

Per chunk, in this order: a uniform score per uncertain activity, normal scores for the
correlated activities (mixed into their uniform scores by the copula), then per risk an
occurrence score and a delay score.
"""

from __future__ import annotations

import numpy as np

CHUNK = 64


class ScoreStream:
    def __init__(self, seed: int, activities: int, correlation, risks: int):
        self.seed = int(seed)
        self.activities = activities
        self.correlation = correlation
        self.risks = risks

    def _generator(self, chunk: int) -> np.random.Generator:
        return np.random.Generator(np.random.PCG64(np.random.SeedSequence(self.seed, spawn_key=(chunk,))))

    def _scores(self, rng: np.random.Generator, out: np.ndarray) -> None:
        rng.random(out=out)
        corr = self.correlation
        if corr is not None and corr.active:
            corr.apply(out, rng.standard_normal((corr.rows.size, CHUNK)))

    def chunks(self, first_chunk: int, chunks: int):
        """The activities' scores chunk by chunk (one reused buffer; no risk draws)."""
        buf = np.empty((self.activities, CHUNK))
        for j in range(chunks):
            self._scores(self._generator(first_chunk + j), buf)
            yield buf

    def block(self, first_chunk: int, chunks: int, with_risks: bool = True):
        """Scores (activities, chunks·CHUNK) and, if asked, risk occurrence and delay scores."""
        width = chunks * CHUNK
        scores = np.empty((self.activities, width))
        occurrence = np.empty((self.risks, width)) if with_risks else None
        delay = np.empty((self.risks, width)) if with_risks else None
        buf = np.empty((self.activities, CHUNK))
        rbuf = np.empty((self.risks, CHUNK))
        for j in range(chunks):
            rng = self._generator(first_chunk + j)
            sl = slice(j * CHUNK, (j + 1) * CHUNK)
            self._scores(rng, buf)
            scores[:, sl] = buf
            if with_risks and self.risks:
                rng.random(out=rbuf)
                occurrence[:, sl] = rbuf
                rng.random(out=rbuf)
                delay[:, sl] = rbuf
        return scores, occurrence, delay
