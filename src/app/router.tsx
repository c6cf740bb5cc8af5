import { BrowserRouter, Route, Routes } from 'react-router';

export function AppRouter() {
  return (
    <BrowserRouter>
      <Routes>
        <Route path="*" element={<main className="p-8 text-title">Arcbench</main>} />
      </Routes>
    </BrowserRouter>
  );
}
